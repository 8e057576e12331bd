import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { formatLimit } from "@/lib/limits";
import { invitationBehind } from "@/lib/sharing/invitations";
import { InvitationNote } from "../invitation-note";
import { safeCallback } from "../safe-callback";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in · Ringside" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  if (await currentUser()) redirect(safeCallback(params.callbackUrl));
  const error = typeof params.error === "string" ? params.error : null;
  const callbackUrl = safeCallback(params.callbackUrl);
  const invitation = await invitationBehind(callbackUrl);
  return (
    <>
      <h1 className="mb-4 text-lg font-semibold">Sign in</h1>
      {invitation && <InvitationNote invitation={invitation} action="sign in" />}
      <SignInForm callbackUrl={callbackUrl} initialError={error} rateWindow={formatLimit("signInWindowMs")} />
      <p className="mt-4 text-center text-sm text-ink-soft">
        No account yet?{" "}
        <Link
          className="font-medium text-ink underline"
          href={callbackUrl === "/" ? "/sign-up" : `/sign-up?callbackUrl=${encodeURIComponent(callbackUrl)}`}
        >
          Create one
        </Link>
      </p>
    </>
  );
}
