import { route } from "@/lib/api/handler";
import { previewLog } from "@/lib/engine/door";
import { readPreviewFile } from "@/lib/vacuum-tests/request";
import { importOverridesSchema, parseInput } from "@/lib/vacuum-tests/schemas";
import { importOptionsOf } from "@/lib/vacuum-tests/options";

export const dynamic = "force-dynamic";

/** POST /api/imports/preview — multipart `file` (+ optional column/unit choices) → columns, first rows, detection. */
export const POST = route({ policy: "vacuumTest.upload", accepts: ["multipart"] }, async ({ form }) => {
  const { file, fields } = await readPreviewFile({ form });
  const overrides = parseInput(importOverridesSchema, fields, "form");
  return previewLog(file.text, importOptionsOf(overrides) ?? {});
});
