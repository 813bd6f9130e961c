// Text that may be far longer than its cell (a 300-digit value, a pasted note): shown up to a
// width and clipped with an ellipsis, the full text on hover and to screen readers.
const LONG = 16;
/** Words in prose are left whole up to this length ("identification", "carbon_equivalent"). */
const LONG_WORD = 28;

export function ClippedText({ text, className = '' }: { text: string; className?: string }) {
  if (text.length <= LONG) return <span className={className}>{text}</span>;
  return (
    <span title={text} data-clipped="true" className={`inline-block max-w-[16ch] truncate align-bottom ${className}`}>
      {text}
    </span>
  );
}

/** A sentence whose long words (values, codes) are clipped one by one, so it still wraps in its cell. */
export function ClippedWords({ text }: { text: string }) {
  const parts = text.split(/(\s+)/);
  if (parts.every((part) => part.length <= LONG_WORD)) return <>{text}</>;
  return <>{parts.map((part, i) => (part.length > LONG_WORD ? <ClippedText key={i} text={part} /> : part))}</>;
}
