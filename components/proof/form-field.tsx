/** A labelled form field with an optional hint and its problem shown right beside it (glyph and words). */
export function FormField({ label, hint, error, children }: { label: string; hint?: string; error?: string; children: React.ReactNode }) {
  return (
    <label className="block text-sm">
      <span className="font-semibold">{label}</span>
      {hint && <span className="ml-2 text-stone-500">{hint}</span>}
      <div className="mt-1">{children}</div>
      {error && (
        <span role="alert" className="mt-1 block text-refuted">
          ✗ {error}
        </span>
      )}
    </label>
  );
}

/** A form's submit button: disabled, and saying `busyLabel`, while the form is being sent. */
export function SubmitButton({
  label,
  busyLabel,
  busy,
  className = "rounded bg-lichen-700 px-3 py-1 text-white hover:bg-lichen-800 disabled:opacity-60",
}: {
  label: string;
  busyLabel: string;
  busy: boolean;
  className?: string;
}) {
  return (
    <button type="submit" disabled={busy} className={className}>
      {busy ? busyLabel : label}
    </button>
  );
}

/** A form's submit button (its label while busy) and the answer that came back, read out politely. */
export function SubmitRow({ label, busyLabel, busy, message }: { label: string; busyLabel: string; busy: boolean; message: string | null }) {
  return (
    <div className="flex items-center gap-3">
      <SubmitButton label={label} busyLabel={busyLabel} busy={busy} />
      {message && (
        <p className="text-sm" aria-live="polite">
          {message}
        </p>
      )}
    </div>
  );
}

/** A form-level problem (the server refused, the network failed). */
export function FormProblem({ message }: { message?: string }) {
  if (!message) return null;
  return (
    <p role="alert" className="text-sm text-refuted">
      {message}
    </p>
  );
}
