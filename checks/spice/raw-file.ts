// Reader for ngspice's binary raw files (`ngspice -b -r FILE`): a text header, then the
// points as little-endian float64, one per variable (two, re and im, for complex plots).

export type RawVariable = { index: number; name: string; type: string };
export type RawPlot = {
  title: string; date: string; plotname: string; flags: string;
  complex: boolean;
  variables: RawVariable[];
  points: number;
  real: Float64Array[];          // per variable; the real part for complex plots
  imag?: Float64Array[];         // per variable, complex plots only
};

export function parseRawFile(buf: Buffer): RawPlot[] {
  const plots: RawPlot[] = [];
  let pos = 0;
  for (;;) {
    while (pos < buf.length && (buf[pos] === 0x0a || buf[pos] === 0x0d || buf[pos] === 0x20)) pos++;
    if (pos >= buf.length) break;
    const { plot, end } = parsePlot(buf, pos);
    plots.push(plot);
    pos = end;
  }
  if (plots.length === 0) throw new Error("raw file holds no plot");
  return plots;
}

function parsePlot(buf: Buffer, start: number): { plot: RawPlot; end: number } {
  const fields: Record<string, string> = {};
  const variables: RawVariable[] = [];
  let pos = start;
  let inVariables = false;
  for (;;) {
    const nl = buf.indexOf(0x0a, pos);
    if (nl < 0) throw new Error("raw file header ends before its data");
    const line = buf.subarray(pos, nl).toString("latin1").replace(/\r$/, "");
    pos = nl + 1;
    if (line === "Binary:") break;
    if (line === "Values:") throw new Error("ASCII raw files are not read here; ngspice must write binary");
    if (inVariables && /^\s/.test(line)) {
      const [index, name, type] = line.trim().split(/\s+/);
      variables.push({ index: Number(index), name, type });
      continue;
    }
    const colon = line.indexOf(":");
    if (colon < 0) continue;
    const key = line.slice(0, colon).trim();
    inVariables = key === "Variables";
    fields[key] = line.slice(colon + 1).trim();
  }
  const nVars = Number(fields["No. Variables"]);
  const points = Number(fields["No. Points"]);
  const flags = fields.Flags ?? "";
  const complex = /complex/i.test(flags);
  if (!Number.isInteger(nVars) || !Number.isInteger(points) || variables.length !== nVars)
    throw new Error(`raw file header is inconsistent (${variables.length} variables listed, "${fields["No. Variables"]}" declared)`);
  const width = complex ? 2 : 1;
  const bytes = points * nVars * width * 8;
  if (pos + bytes > buf.length) throw new Error(`raw file is truncated: ${points} points declared, ${buf.length - pos} data bytes present`);
  const real = variables.map(() => new Float64Array(points));
  const imag = complex ? variables.map(() => new Float64Array(points)) : undefined;
  // A DataView reads the doubles in place: no alignment copy, little-endian on any host.
  const data = new DataView(buf.buffer, buf.byteOffset + pos, bytes);
  const stride = nVars * width * 8;
  for (let v = 0; v < nVars; v++) {
    const re = real[v];
    const im = imag?.[v];
    for (let k = 0, j = v * width * 8; k < points; k++, j += stride) {
      re[k] = data.getFloat64(j, true);
      if (im) im[k] = data.getFloat64(j + 8, true);
    }
  }
  const p = pos + bytes;
  const plot: RawPlot = {
    title: fields.Title ?? "", date: fields.Date ?? "", plotname: fields.Plotname ?? "", flags,
    complex, variables, points, real, ...(imag ? { imag } : {}),
  };
  return { plot, end: p };
}
