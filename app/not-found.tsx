import Link from "next/link";

export default function NotFound() {
  return (
    <main id="main" className="mx-auto flex max-w-xl flex-col gap-4 px-4 py-16">
      <h1>Not found</h1>
      <p>That page does not exist, or it is not yours to see.</p>
      <Link href="/" className="btn btn-primary self-start">
        Back to home
      </Link>
    </main>
  );
}
