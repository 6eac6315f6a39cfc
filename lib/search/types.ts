import type { z } from "zod";
import type { blockSummarySchema, searchResultSchema } from "@/lib/openapi/responses";

// One search-result type end to end: the search service returns it, /api/v1/blocks answers it (its OpenAPI schema
// is the source), the library page's query and the block table read it. Type-only, so client code may import it.
export type BlockSummary = z.infer<typeof blockSummarySchema>;
export type SearchResult = z.infer<typeof searchResultSchema>;
export type HighlightRun = NonNullable<BlockSummary["highlight"]>["title"][number];
