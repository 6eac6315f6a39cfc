// Imported by the health route: each part registers its probe with lib/health/health.ts here.
export {};
