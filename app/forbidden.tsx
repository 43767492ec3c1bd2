import Link from "next/link";

export default function Forbidden() {
  return (
    <main id="main" className="mx-auto flex max-w-xl flex-col gap-4 px-4 py-16">
      <h1>Your role does not open this page</h1>
      <p>If you need it for your work, ask an admin to change your role.</p>
      <Link href="/" className="btn btn-primary self-start">
        Back to home
      </Link>
    </main>
  );
}
