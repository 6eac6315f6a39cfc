/** Every plotted series as CSV: one column per series, headed with its name and unit, one row per x value. */
export function plotCsv(headers: string[], columns: ArrayLike<number | null>[]): string {
  const quote = (s: string) => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
  const rows = [headers.map(quote).join(",")];
  const n = columns[0]?.length ?? 0;
  for (let i = 0; i < n; i++) rows.push(columns.map((c) => (c[i] == null ? "" : String(c[i]))).join(","));
  return rows.join("\n") + "\n";
}

export function downloadText(text: string, fileName: string, type = "text/csv") {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = Object.assign(document.createElement("a"), { href: url, download: fileName });
  document.body.append(a);
  a.click();
  a.remove();
  URL.revokeObjectURL(url);
}
