import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "./_components/forgot-password-form";

export const metadata: Metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1>Forgot your password?</h1>
      <p>Give the e-mail address of your account. We send a link to choose a new password; it works for one hour.</p>
      <ForgotPasswordForm />
      <Link href="/sign-in" className="self-start py-2">
        Back to sign in
      </Link>
    </>
  );
}
