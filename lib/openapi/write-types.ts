import { writeFileSync } from "node:fs";
import { renderSchemaTypes, SCHEMA_TYPES_PATH } from "./generate-types";

renderSchemaTypes().then((text) => {
  writeFileSync(SCHEMA_TYPES_PATH, text);
  console.log(`wrote ${SCHEMA_TYPES_PATH}`);
});
