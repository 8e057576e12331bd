import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { PASSWORD_RULE } from "@/lib/auth/password";
import { SignUpForm } from "./sign-up-form";

export const metadata: Metadata = { title: "Create an account · Ringside" };

export default async function SignUpPage() {
  if (await currentUser()) redirect("/");
  return (
    <>
      <h1 className="mb-4 text-lg font-semibold">Create an account</h1>
      <SignUpForm passwordRule={PASSWORD_RULE} />
      <p className="mt-4 text-center text-sm text-ink-soft">
        Already have one?{" "}
        <Link className="font-medium text-ink underline" href="/sign-in">
          Sign in
        </Link>
      </p>
    </>
  );
}
