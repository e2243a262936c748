import type { InputHTMLAttributes } from "react";

/** An `<input>` bound to a string state: `onValue` gets the new text; every other prop goes to the input. */
export function TextInput({ onValue, ...input }: Omit<InputHTMLAttributes<HTMLInputElement>, "onChange"> & { onValue: (value: string) => void }) {
  return <input {...input} onChange={(e) => onValue(e.target.value)} />;
}
