import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { PASSWORD_RULE } from "@/lib/auth/password";
import { invitationBehind } from "@/lib/sharing/invitations";
import { InvitationNote } from "../invitation-note";
import { safeCallback } from "../safe-callback";
import { SignUpForm } from "./sign-up-form";

export const metadata: Metadata = { title: "Create an account · Ringside" };

/// `?callbackUrl=` (a same-site path) is where the new account goes after signing up: an
/// invitation link brings its invitee back to the invitation.
export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const callbackUrl = safeCallback((await searchParams).callbackUrl);
  if (await currentUser()) redirect(callbackUrl);
  const invitation = await invitationBehind(callbackUrl);
  return (
    <>
      <h1 className="mb-4 text-lg font-semibold">Create an account</h1>
      {invitation && <InvitationNote invitation={invitation} action="sign up" />}
      <SignUpForm passwordRule={PASSWORD_RULE} callbackUrl={callbackUrl} email={invitation?.email} />
      <p className="mt-4 text-center text-sm text-ink-soft">
        Already have one?{" "}
        <Link
          className="font-medium text-ink underline"
          href={callbackUrl === "/" ? "/sign-in" : `/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}`}
        >
          Sign in
        </Link>
      </p>
    </>
  );
}
