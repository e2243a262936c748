/** The bordered form, with its heading, in which a claim (or a file of claims) is attached to a step. */
export function ClaimPanel({
  name,
  title,
  onSubmit,
  children,
}: {
  name: string;
  title: string;
  onSubmit: (e: React.FormEvent<HTMLFormElement>) => void;
  children: React.ReactNode;
}) {
  return (
    <form onSubmit={onSubmit} className="mt-6 space-y-3 rounded border border-stone-200 bg-white p-4" aria-labelledby={`${name}-heading`} data-testid={name}>
      <h3 id={`${name}-heading`} className="font-semibold">
        {title}
      </h3>
      {children}
    </form>
  );
}
