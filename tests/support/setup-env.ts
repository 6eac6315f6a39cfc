import { inject } from "vitest";

// Workers get the URLs of the services global-setup started.
Object.assign(process.env, inject("assayEnv"));
