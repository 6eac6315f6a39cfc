// Bench blocks: our own values, not part of the demo library.

const tolParams = [
  "  - { name: R1, value: 10 kohm, tol: 1% }",
  "  - { name: R2, value: 22 kohm, tol: 1% }",
  "  - { name: R3, value: 4.7 kohm, tol: 1% }",
  "  - { name: R4, value: 47 kohm, tol: 1% }",
  "  - { name: C1, value: 10 nF, tol: 5% }",
  "  - { name: C2, value: 4.7 nF, tol: 5% }",
  "  - { name: Vs, value: 12 V, tol: 0.5 V }",
  "  - { name: Vref, value: 2.5 V, tol: 0.2% }",
  "  - { name: Gm, value: 1.5, tol: 2% }",
  "  - { name: Il, value: 2 mA, tol: 10% }",
].join("\n");

/** No simulation: 10 toleranced parameters, so every check runs at 2^10 = 1024 corners. */
export const expressionBlock = `---
slug: bench-expressions
title: Bench block, expressions only
category: other
tags: [bench]
summary: Design equations over ten toleranced parameters.
params:
${tolParams}
---
Equations only.

\`\`\`spice
* not simulated
R1 a 0 {R1}
\`\`\`

\`\`\`check
fc = 1 / (2 pi sqrt(R1 R2 C1 C2)) to Hz
q = sqrt(R1 R2 C1 C2) / ((R1 + R2) C2)
check("corner near 1.6 kHz", near(fc, 1.5 kHz, 20%))
check("Q in range", q > 0.5 and q < 1.2)
gain = Gm (1 + R4 / R3)
check("gain between 10 and 20", gain > 10 and gain < 20)
vdiv = Vs R3 / (R3 + R4)
check("divider below the reference", vdiv < Vref)
p = Vs Il to mW
check("load power under 30 mW", p < 30 mW)
\`\`\`
`;

/** A Wien-bridge oscillator (ideal op-amp as a VCVS, diode limiting) run for 60 ms. */
export const oscillatorBlock = `---
slug: bench-wien-60ms
title: Bench Wien-bridge oscillator, 60 ms transient
category: oscillator
tags: [bench]
summary: One 60 ms transient with frequency, amplitude and distortion measured.
params:
  - { name: R, value: 10 kohm }
  - { name: C, value: 15.9 nF }
  - { name: Rg, value: 10 kohm }
  - { name: Rf1, value: 15 kohm }
  - { name: Rf2, value: 5.9 kohm }
---
Loop gain about 1.03.

\`\`\`spice
* Wien bridge, diode-limited
Rs out a {R}
Cs a p {C}
Rp p 0 {R}
Cp p 0 {C}
Rg n 0 {Rg}
Rf1 out m {Rf1}
Rf2 m n {Rf2}
D1 m n dlim
D2 n m dlim
.model dlim D(IS=1e-14 N=1)
E1 out 0 p n 1e5
.ic v(p)=0.01
\`\`\`

\`\`\`check
f0 = 1 / (2 pi R C) to Hz
res = tran(60 ms, 1 us, "uic")
check("oscillates near f0", near(freq(res, "out", 40 ms, 60 ms), f0, 2%))
check("amplitude above 2 V", peak(res, "out", 40 ms, 60 ms) > 2 V)
check("distortion below 4%", thd(res, "out", 40 ms, 60 ms) < 4%)
\`\`\`
`;

export const OSC_ANALYSIS = ".tran 1e-6 0.06 uic";
