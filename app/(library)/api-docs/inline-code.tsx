/** OpenAPI descriptions mark names with backticks (CommonMark); set those as code instead of showing the ticks. */
export function InlineCode({ text }: { text: string }) {
  return (
    <>
      {text.split(/(`[^`]+`)/g).map((part, i) =>
        part.startsWith("`") && part.endsWith("`") && part.length > 2
          ? <code key={i} className="font-mono text-[0.92em]">{part.slice(1, -1)}</code>
          : part,
      )}
    </>
  );
}
