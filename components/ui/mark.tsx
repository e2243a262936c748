/**
 * A state or verdict mark: a shape of its own and a word in small capitals, coloured only on the shape
 * (the word says it without colour). Used for claim verdicts, case and proof states, vouches and disputes.
 */
export function Mark({ glyph, word, tone, data, pulse = false }: { glyph: string; word: string; tone: string; data: Record<string, string>; pulse?: boolean }) {
  return (
    <span className="inline-flex shrink-0 items-baseline gap-1 whitespace-nowrap text-sm tracking-wide text-stone-800 [font-variant-caps:all-small-caps]" {...data}>
      <span aria-hidden="true" className={`${tone} ${pulse ? "animate-pulse" : ""}`}>
        {glyph}
      </span>
      {word}
    </span>
  );
}
