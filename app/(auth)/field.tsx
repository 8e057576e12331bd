import type { InputHTMLAttributes, ReactNode } from "react";

/// One labelled input of the sign-in and sign-up forms; `children` go under the input.
export function Field({
  id,
  label,
  children,
  ...input
}: { id: string; label: string; children?: ReactNode } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input id={id} name={id} required className="field-input" {...input} />
      {children}
    </div>
  );
}
