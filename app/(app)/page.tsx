import Link from "next/link";
import { navigationFor, roleLabels, type Role } from "@/lib/auth/permissions";
import { requirePageUser } from "@/lib/auth/session";
import { listClassesOfUser } from "@/lib/classes";

const roleIntro: Record<Role, string> = {
  student: "Your classes are below. The task cards your instructors assign will be listed here too.",
  instructor: "Your classes and their students are under Classes.",
  librarian: "You keep the school's manuals current; the library opens here as it is built.",
  admin: "You manage accounts, roles and classes, and can read the audit log.",
};

export default async function HomePage() {
  const user = await requirePageUser();
  const myClasses = await listClassesOfUser({ userId: user.id });
  const shortcuts = navigationFor(user).filter((n) => n.href !== "/");
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1>Hello, {user.name}</h1>
        <p className="text-ink-soft">
          Signed in as {roleLabels[user.role].toLowerCase()}. {roleIntro[user.role]}
        </p>
      </div>
      {shortcuts.length ? (
        <section aria-labelledby="shortcuts" className="flex flex-col gap-2">
          <h2 id="shortcuts">Go to</h2>
          <div className="flex flex-wrap gap-3">
            {shortcuts.map((s) => (
              <Link key={s.href} href={s.href} className="btn btn-secondary">
                {s.label}
              </Link>
            ))}
          </div>
        </section>
      ) : null}
      <section aria-labelledby="my-classes" className="panel flex flex-col gap-3">
        <h2 id="my-classes">My classes</h2>
        {myClasses.length ? (
          <ul className="flex flex-col gap-2">
            {myClasses.map((c) => (
              <li key={c.id} className="text-lg">
                <strong>{c.name}</strong>
                {c.startsOn && c.endsOn ? <span className="text-ink-soft"> · {c.startsOn} to {c.endsOn}</span> : null}
              </li>
            ))}
          </ul>
        ) : (
          <p>You are not in any class yet. An admin adds you to one.</p>
        )}
      </section>
    </div>
  );
}
