/** The Assay wordmark: a small struck hexagon in copper and the name in Literata. */
export function Wordmark() {
  return (
    <span className="inline-flex items-center gap-2">
      <svg width="26" height="22" viewBox="0 0 26 22" aria-hidden>
        <path d="M7 1.5 H19 L24.5 11 L19 20.5 H7 L1.5 11 Z" fill="none" stroke="#b0623a" strokeWidth="2" strokeLinejoin="round" />
        <path d="M8.5 11 l3 3.2 l6 -6.6" fill="none" stroke="#b0623a" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
      <span className="font-serif text-xl font-semibold tracking-tight text-ink">Assay</span>
    </span>
  );
}
