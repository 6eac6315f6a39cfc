import os from "node:os";

// Reader for ngspice's binary raw files (`ngspice -b -r FILE`): a text header, then the
// points as little-endian float64, one per variable (two, re and im, for complex plots).

const BIG_ENDIAN = os.endianness() === "BE";

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
  while (pos < buf.length) {
    if (buf.subarray(pos).toString("latin1").trim() === "") break;
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
  // One aligned copy, then de-interleave: much faster than a readDoubleLE per value.
  const data = new Float64Array(buf.buffer.slice(buf.byteOffset + pos, buf.byteOffset + pos + bytes));
  if (BIG_ENDIAN) for (let b = 0; b < bytes; b += 8) data[b / 8] = buf.readDoubleLE(pos + b);
  const stride = nVars * width;
  for (let v = 0; v < nVars; v++) {
    const re = real[v];
    const im = imag?.[v];
    for (let k = 0, j = v * width; k < points; k++, j += stride) {
      re[k] = data[j];
      if (im) im[k] = data[j + 1];
    }
  }
  const p = pos + bytes;
  const plot: RawPlot = {
    title: fields.Title ?? "", date: fields.Date ?? "", plotname: fields.Plotname ?? "", flags,
    complex, variables, points, real, ...(imag ? { imag } : {}),
  };
  return { plot, end: p };
}
