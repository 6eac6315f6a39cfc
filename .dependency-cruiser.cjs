// The arrows of the code base (DEVELOPERS.md): app → lib → checks, never back. Checked by `npm test`
// (scripts/test.sh runs `npm run -s lint:imports`), and tests/unit/import-rules.test.ts plants a back-import to see it fail.
/** @type {import("dependency-cruiser").IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: "checks-stands-alone",
      comment: "checks/ is the engine: text in, report out. It knows nothing of the web app, its database or its pages.",
      severity: "error",
      from: { path: "^checks/" },
      to: { path: "^(app|lib|components|entities|migrations|scripts)/" },
    },
    {
      name: "components-do-not-import-app",
      comment: "Components get server actions from lib/actions/ or as props, never from a route folder.",
      severity: "error",
      from: { path: "^components/" },
      to: { path: "^app/" },
    },
    {
      name: "lib-does-not-import-app-or-components",
      comment: "lib/ (services, queries, validation) sits below the pages and components that use it.",
      severity: "error",
      from: { path: "^lib/" },
      to: { path: "^(app|components)/" },
    },
    {
      name: "entities-are-leaves",
      comment: "Entities describe tables; they call no service and render nothing.",
      severity: "error",
      from: { path: "^entities/" },
      to: { path: "^(app|lib|components)/" },
    },
    {
      name: "worker-and-clis-run-without-server-only",
      comment: "`server-only` throws outside Next's server build: nothing the worker or a CLI imports may reach it.",
      severity: "error",
      from: { path: "^scripts/" },
      to: { path: "node_modules/server-only/", reachable: true },
    },
  ],
  options: {
    tsConfig: { fileName: "tsconfig.json" },
    tsPreCompilationDeps: true,
    doNotFollow: { path: "node_modules" },
    exclude: { path: "^(\\.next|tests|bench)/" },
    enhancedResolveOptions: { exportsFields: ["exports"], conditionNames: ["import", "require", "node", "default"] },
  },
};
