import { EntitySchema, type Opt } from "@mikro-orm/core";
import type { BlockVersion } from "./block-version.entity";
import type { User } from "./user.entity";

export type ReviewDecision = "requested" | "approved" | "changes-requested";

// "requested" rows are the review queue; a decision row answers one version.
export interface Review {
  id: number;
  version: BlockVersion;
  reviewer: User | null;
  requestedBy: User | null;
  decision: ReviewDecision;
  comment: string;
  createdAt: Opt<Date>;
}

export const ReviewSchema = new EntitySchema<Review>({
  name: "Review",
  tableName: "reviews",
  properties: {
    id: { type: "integer", primary: true, autoincrement: true },
    version: { kind: "m:1", entity: "BlockVersion", deleteRule: "cascade" },
    reviewer: { kind: "m:1", entity: "User", nullable: true },
    requestedBy: { kind: "m:1", entity: "User", nullable: true },
    decision: { type: "string", length: 24 },
    comment: { type: "text", default: "" },
    createdAt: { type: "Date", onCreate: () => new Date() },
  },
});
