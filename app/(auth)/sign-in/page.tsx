import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { getCurrentUser } from "@/app/_adapters/session";
import { SignInForm } from "./_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

/** Only same-site paths: a `next` of "//elsewhere" or "https://…" must not send anyone away. */
function safeNext(value: string | string[] | undefined): string {
  const next = Array.isArray(value) ? value[0] : value;
  return next && next.startsWith("/") && !next.startsWith("//") && !next.startsWith("/\\") ? next : "/";
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const next = safeNext(params.next);
  if (await getCurrentUser()) redirect(next);
  return (
    <>
      <h1>Sign in</h1>
      {params.password === "set" ? (
        <p className="notice-ok" role="status">
          Your password is set. Sign in with it now.
        </p>
      ) : null}
      <SignInForm next={next} />
    </>
  );
}
