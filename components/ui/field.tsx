import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from "react";

/** A labelled control with its hint and its error in an aria-live region beside it. */
export function Field({
  id,
  label,
  hint,
  error,
  children,
}: {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  children: ReactNode;
}) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium text-ink-muted">
        {label}
      </label>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="text-2xs text-ink-faint">
          {hint}
        </p>
      )}
      <p id={`${id}-error`} aria-live="polite" className="min-h-0 text-2xs font-medium text-bad">
        {error}
      </p>
    </div>
  );
}

export const inputClass =
  "w-full rounded border border-line bg-panel px-2 py-1.5 text-sm text-ink num placeholder:text-ink-faint aria-[invalid=true]:border-bad focus:border-copper focus:outline-none";

export function TextInput(props: InputHTMLAttributes<HTMLInputElement>) {
  return <input {...props} className={`${inputClass} ${props.className ?? ""}`} />;
}

export function Select(props: SelectHTMLAttributes<HTMLSelectElement>) {
  return <select {...props} className={`${inputClass} ${props.className ?? ""}`} />;
}
