// The two kinds of block the run bench stores: design equations only, and a simulated oscillator.
export const dividerBlock = (slug: string, r2: string): string => `---
slug: ${slug}
title: Resistive divider (bench)
category: reference
tags: [bench]
summary: Expression checks only.
params:
  - { name: R1, value: 10 kohm, tol: 1% }
  - { name: R2, value: ${r2}, tol: 1% }
  - { name: Vin, value: 5 V, tol: 2% }
---
Vout = Vin R2 / (R1 + R2).

\`\`\`spice
V1 in 0 {Vin}
R1 in out {R1}
R2 out 0 {R2}
\`\`\`

\`\`\`check
Vout = Vin R2 / (R1 + R2)
check("output within 2.3 V to 2.7 V at every corner", Vout > 2.3 V and Vout < 2.7 V)
\`\`\`
`;

export const wienBlock = (slug: string, rf: string): string => `---
slug: ${slug}
title: Wien-bridge oscillator (bench)
category: oscillator
tags: [bench]
summary: A 20 ms transient of a Wien bridge without amplitude control.
params:
  - { name: R, value: 10 kohm, tol: 1% }
  - { name: C, value: 10 nF, tol: 5% }
  - { name: Rg, value: 10 kohm, tol: 1% }
  - { name: Rf, value: ${rf}, tol: 1% }
  - { name: Vkick, value: 0.5 V }
---
Loop gain (1 + Rf/Rg)/3.

\`\`\`spice
.include opamp-1pole.lib
X1 p n out OA1P
Rs out a {R}
Cs a p {C}
Rp p 0 {R}
Cp p 0 {C}
Rg n 0 {Rg}
Rf n out {Rf}
.ic v(p)={Vkick}
\`\`\`

\`\`\`check
loop_gain = (1 + Rf / Rg) / 3
check("loop gain above one at every corner", loop_gain > 1.02)
res = tran(20 ms, 10 us)
check("the oscillation builds up", pp(res, "out", 15 ms, 20 ms) > 10 Vkick)
\`\`\`
`;

/** The same oscillator with montecarlo(n): nominal, its tolerance points and n seeded samples, all simulated. */
export const wienMonteCarloBlock = (slug: string, rf: string, n: number): string =>
  wienBlock(slug, rf).replace("res = tran(20 ms, 10 us)", `montecarlo(${n})\nres = tran(20 ms, 10 us)`);
