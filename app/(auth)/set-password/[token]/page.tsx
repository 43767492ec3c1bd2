import type { Metadata } from "next";
import Link from "next/link";
import { describeLinkToken } from "@/lib/server/accounts";
import { SetPasswordForm } from "./_components/set-password-form";

export const metadata: Metadata = { title: "Choose a password" };

export default async function SetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = token.length <= 200 ? await describeLinkToken({ token }) : null;
  if (!link) {
    return (
      <>
        <h1>This link does not work any more</h1>
        <p className="notice-error" role="alert">
          It has expired or was already used. Ask for a new one below, or ask an admin to send the invitation again.
        </p>
        <Link href="/forgot-password" className="btn btn-primary">
          Ask for a new link
        </Link>
      </>
    );
  }
  return (
    <>
      <h1>{link.purpose === "invitation" ? `Welcome, ${link.name}` : "Choose a new password"}</h1>
      <p>
        Choose the password for <strong>{link.email}</strong>. Use at least 10 characters; a few unrelated words are easy to remember and
        hard to guess.
      </p>
      <SetPasswordForm token={token} />
    </>
  );
}
