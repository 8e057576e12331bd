"use client";

import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field } from "../field";

/// `callbackUrl` is where the new account goes (an invitation it came from); `email`
/// pre-fills the address an invitation was sent to.
export function SignUpForm({ passwordRule, callbackUrl = "/", email }: { passwordRule: string; callbackUrl?: string; email?: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const body = {
      name: String(form.get("name") ?? ""),
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
    };
    setBusy(true);
    setError(null);
    const response = await fetch("/api/auth/signup", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify(body),
    });
    if (!response.ok) {
      const answer = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
      setError(answer?.error?.message ?? `Sign-up failed (HTTP ${response.status}).`);
      setBusy(false);
      return;
    }
    const result = await signIn("credentials", { email: body.email, password: body.password, redirect: false });
    setBusy(false);
    if (result?.ok) {
      router.replace(callbackUrl);
      router.refresh();
    } else {
      router.replace(callbackUrl === "/" ? "/sign-in" : `/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}`);
    }
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <Field id="name" label="Name" type="text" autoComplete="name" />
      <Field id="email" label="Email" type="email" autoComplete="email" defaultValue={email} />
      <Field id="password" label="Password" type="password" autoComplete="new-password" aria-describedby="password-rule">
        <p id="password-rule" className="mt-1 text-xs text-ink-soft">
          {passwordRule}
        </p>
      </Field>
      {error && (
        <p role="alert" className="rounded-md bg-signal-soft/60 px-3 py-2 text-sm text-ink">
          {error}
        </p>
      )}
      <button type="submit" className="button-primary" disabled={busy}>
        {busy ? "Creating…" : "Create account"}
      </button>
    </form>
  );
}
