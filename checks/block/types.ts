export type BlockError = { message: string; line?: number };

export type ParamSpec = {
  name: string;
  value: string;
  tol?: string;
  /** Monte Carlo distribution: normal (default, tol = 3σ) or uniform over the band. */
  dist?: "normal" | "uniform";
  note?: string;
  si: number;
  unit: string;
  line: number;
};

export type ParsedBlock = {
  slug: string;
  title: string;
  category: string;
  tags: string[];
  summary: string;
  hazard: string[];
  params: ParamSpec[];
  body: string;
  note: string;
  netlist: string;
  script: string;
  /** Block-file line of the first line inside the ```spice fence (0 when there is none). */
  netlistLine: number;
  /** Block-file line of the first line inside the ```check fence (0 when there is none). */
  scriptLine: number;
};

/** A block's slug: lowercase letters and digits in words joined by single hyphens (the file's and the server's one rule). */
export const SLUG_RULE = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;
export const CATEGORIES = ["oscillator", "limiter", "filter", "amplifier", "reference", "power", "interface", "other"];
export const HAZARDS = ["mains", "high-voltage", "high-current", "heat"];
