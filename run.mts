import { evaluateBlock } from "/work/wt/engine/checks/engine/evaluate-block";
const script = process.argv[2].replace(/\\n/g, "\n");
const params = process.argv[3]?.replace(/\\n/g, "\n") ?? "  - { name: Rs, value: 1 kohm }\n  - { name: Rp, value: 2 kohm }\n";
const text = `---\nslug: t\ntitle: T\ncategory: other\nsummary: s\nparams:\n${params}---\n\`\`\`check\n${script}\n\`\`\`\n`;
const r = evaluateBlock(text).report;
console.log(JSON.stringify({ q: r.quantities, c: r.checks.map((c) => [c.status, c.detail]), e: r.errors }, null, 1));
