import type { UseFormRegisterReturn } from "react-hook-form";

/** A labelled input with its error under it; the error is announced to screen readers. */
export function Field(props: {
  label: string;
  type?: string;
  autoComplete?: string;
  error?: string;
  registration: UseFormRegisterReturn;
  testId?: string;
  hint?: string;
}) {
  const id = `f-${props.registration.name}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium text-graphite-800">
        {props.label}
      </label>
      <input
        id={id}
        type={props.type ?? "text"}
        autoComplete={props.autoComplete}
        aria-invalid={props.error ? true : undefined}
        aria-describedby={props.error ? `${id}-err` : undefined}
        className="mt-1 w-full rounded-md border border-graphite-300 bg-white px-3 py-2 outline-none focus:border-copper-500"
        data-testid={props.testId}
        {...props.registration}
      />
      {props.hint && !props.error ? <p className="mt-1 text-xs text-graphite-500">{props.hint}</p> : null}
      {props.error ? (
        <p id={`${id}-err`} className="mt-1 text-sm text-over" role="alert">
          {props.error}
        </p>
      ) : null}
    </div>
  );
}

export function FormError({ message }: { message?: string | null }) {
  if (!message) return null;
  return (
    <p className="rounded-md border border-over/30 bg-over-soft px-3 py-2 text-sm text-over" role="alert" data-testid="form-error">
      {message}
    </p>
  );
}

export function AuthCard({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div className="mx-auto max-w-md px-4 py-12">
      <h1 className="text-2xl font-semibold tracking-tight">{title}</h1>
      <div className="mt-6 rounded-lg border border-graphite-100 bg-paper-raised p-6">{children}</div>
    </div>
  );
}

export const primaryButton =
  "w-full rounded-md bg-copper-600 px-4 py-2.5 font-semibold text-white hover:bg-copper-700 disabled:cursor-wait disabled:opacity-60";
