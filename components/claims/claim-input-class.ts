/** The look of a text input or select in the claim forms (one place, so the forms stay alike). */
export const claimInputClass = "w-full rounded border border-stone-300 bg-white px-2 py-1 font-mono text-sm";
