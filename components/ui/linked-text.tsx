/** Plain text with its http(s) addresses made into links (for stored mail bodies); nothing else is interpreted. */
const URL_PATTERN = /(https?:\/\/[^\s<>"“”]+[^\s<>"“”.,;:!?)])/g;

export function LinkedText({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <>
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <a key={i} href={part} className="text-lichen-700 underline" rel="noreferrer">
            {part}
          </a>
        ) : (
          part
        ),
      )}
    </>
  );
}
