import type { ReactNode, SelectHTMLAttributes } from "react";

/** One option of a Choice: the value sent, and what the reader sees. */
export type ChoiceOption = readonly [value: string, shown: ReactNode];

/** A `<select>` over [value, shown] pairs; every other prop (value, onChange, a form library's register(), …) goes to the select. */
export function Choice({ options, ...select }: Omit<SelectHTMLAttributes<HTMLSelectElement>, "children"> & { options: ReadonlyArray<ChoiceOption> }) {
  return (
    <select {...select}>
      {options.map(([value, shown]) => (
        <option key={value} value={value}>
          {shown}
        </option>
      ))}
    </select>
  );
}
