"use client";

import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field } from "../field";

/// What the form says for each refusal; `rateWindow` is the limit `signInWindowMs` as text
/// ("15 min"), handed over by the server page (client code does not read lib/limits.ts).
function messages(rateWindow: string): Record<string, string> {
  return {
    rate_limited: `Too many failed sign-in attempts. Wait ${rateWindow}, then try again.`,
    busy: "Too many sign-ins are being checked right now. Try again in a few seconds.",
    CredentialsSignin: "That e-mail and password do not match an account.",
  };
}

export function SignInForm({
  callbackUrl,
  initialError,
  rateWindow,
}: {
  callbackUrl: string;
  initialError: string | null;
  rateWindow: string;
}) {
  const router = useRouter();
  const MESSAGES = messages(rateWindow);
  const [error, setError] = useState<string | null>(initialError ? (MESSAGES[initialError] ?? "Sign-in failed.") : null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setError(null);
    const result = await signIn("credentials", {
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      redirect: false,
    });
    setBusy(false);
    if (result?.ok) {
      router.replace(callbackUrl);
      router.refresh();
    } else if (result?.status === 429) {
      setError(MESSAGES.rate_limited!);
    } else if (result?.status === 503) {
      setError(MESSAGES.busy!);
    } else {
      setError(MESSAGES.CredentialsSignin!);
    }
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <Field id="email" label="Email" type="email" autoComplete="username" />
      <Field id="password" label="Password" type="password" autoComplete="current-password" />
      {error && (
        <p role="alert" className="rounded-md bg-signal-soft/60 px-3 py-2 text-sm text-ink">
          {error}
        </p>
      )}
      <button type="submit" className="button-primary" disabled={busy}>
        {busy ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
