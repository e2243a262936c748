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

/** A form-level problem (the server refused, the network failed). */
export function FormProblem({ message }: { message?: string }) {
  if (!message) return null;
  return (
    <p role="alert" className="text-sm text-refuted">
      {message}
    </p>
  );
}
