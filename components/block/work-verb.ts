/** One verb on the block's bench: text in copper between thin rules, not a boxed button. */
export const workVerb = "inline-flex items-center gap-1.5 px-3 py-1.5 text-sm text-copper-dark hover:bg-copper-pale/60 disabled:opacity-60";
