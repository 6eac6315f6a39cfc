import { searchBacklog, searchHealth } from "@/lib/search/health";
import { workerHealth } from "@/lib/runs/worker-health";
import { registerBacklogProbe, registerHealthProbe } from "./health";

// Imported by the health route: each part registers its probe here.
registerHealthProbe("search", searchHealth);
registerBacklogProbe(searchBacklog);
registerHealthProbe("worker", workerHealth);
