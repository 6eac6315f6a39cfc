import { withParams } from "@/checks";

/**
 * The live preview and the retune assistant compute from the head's file (the API takes values, not a version).
 * Forking an older version, the preview is still exact when that version is the head with other values:
 * then sending the older version's values reproduces it. Otherwise the netlist, expressions or checks differ.
 */
export function sameFileUpToValues(headText: string, olderText: string, olderValues: Record<string, string>): boolean {
  try {
    return withParams(headText, olderValues) === olderText;
  } catch {
    return false;
  }
}
