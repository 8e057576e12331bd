import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { safeCallback } from "../safe-callback";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in · Ringside" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  if (await currentUser()) redirect(safeCallback(params.callbackUrl));
  const error = typeof params.error === "string" ? params.error : null;
  return (
    <>
      <h1 className="mb-4 text-lg font-semibold">Sign in</h1>
      <SignInForm callbackUrl={safeCallback(params.callbackUrl)} initialError={error} />
      <p className="mt-4 text-center text-sm text-ink-soft">
        No account yet?{" "}
        <Link className="font-medium text-ink underline" href="/sign-up">
          Create one
        </Link>
      </p>
    </>
  );
}
