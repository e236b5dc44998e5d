import { z } from "zod";
import { deleteImport, listImports } from "../../../db/imports.ts";
import { ImportOptions } from "../../import/importOptions.ts";
import { refuseDemoImport } from "../../services/datasets/refuseDemoImport.ts";
import { importFiles } from "../../services/importFiles.ts";
import { previewImports } from "../../services/imports/previewImports.ts";
import { CONFLICT_CHOICES } from "../../services/imports/resolveImport.ts";
import { sortSourceFiles } from "../../services/imports/sortSourceFiles.ts";
import { UserError } from "../../userError.ts";
import { requestValidationError } from "../httpError.ts";
import { readMultipart } from "../readMultipart.ts";
import { defineRoute, IdParams } from "../route.ts";

/** Form fields of an upload: the import options, as text. */
const UploadFields = z.object({
  format: z.enum(["auto", "long", "wide"]).optional(),
  delimiter: z.enum(["auto", ",", ";", "\t"]).optional(),
  decimalMark: z.enum(["auto", ".", ","]).optional(),
  positionUnit: z.enum(["auto", "um", "px", "fraction"]).optional(),
  pixelSizeUm: z.coerce.number().positive().optional(),
  lengthUm: z.coerce.number().positive().optional(),
  genotype: z.string().optional(),
  channel: z.string().optional(),
  labelPrefix: z.string().optional(),
  flip: z.enum(["none", "auto"]).optional(),
  /** What to do with values that differ from stored embryos: refuse (default), keep the stored ones, or replace them (recorded, undone on delete). */
  onConflict: z.enum(CONFLICT_CHOICES).default("refuse"),
});

const UPLOAD_FIELDS = {
  files: "one or more CSV/TSV profile exports (field name: files)",
  meta: "optional metadata side file (one row per embryo)",
  ...Object.fromEntries(Object.keys(UploadFields.shape).map((k) => [k, "import option, as in the command line"])),
};

async function readUpload(req: Parameters<typeof readMultipart>[0]) {
  const defaults = ImportOptions.parse({});
  const body = await readMultipart(req, { maxFileBytes: defaults.maxBytes, maxFiles: 50 });
  const empty = Object.fromEntries(Object.entries(body.fields).filter(([, v]) => v !== ""));
  const fields = UploadFields.safeParse(empty);
  if (!fields.success) throw requestValidationError(fields.error, "body");
  const { onConflict, ...importOptions } = fields.data;
  const options = ImportOptions.parse(importOptions);
  const given = body.files.files ?? [];
  if (given.length === 0) throw new UserError("no-files", 'No file was uploaded: send at least one file in the "files" field.', { status: 400 });
  const { profiles: files, meta, notes } = sortSourceFiles(given, body.files.meta?.[0], options);
  return { files, meta, options, onConflict, notes };
}

export const importRoutes = [
  defineRoute({
    method: "post",
    path: "/api/imports/preview",
    tag: "imports",
    summary: "Parse uploaded files without storing anything",
    description:
      "Shows the detected shape, separator, decimal mark, column roles and units, embryos and warnings, or the reasons a file would be rejected; " +
      "and how the file compares with the open database: embryos already stored, what would be added (a new channel, values they lack), conflicts with stored values, " +
      "and an earlier import of the same bytes. Refused while the demo data set is open.",
    multipart: { fields: UPLOAD_FIELDS },
    async handler({ req, db }) {
      const { files, meta, options, onConflict, notes } = await readUpload(req);
      refuseDemoImport(db, "page");
      return { files: previewImports(db, files, options, meta, onConflict), notes };
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/imports",
    tag: "imports",
    summary: "Import uploaded profile files (each file all-or-nothing; values that differ from stored embryos are refused unless onConflict says keep or replace)",
    multipart: { fields: UPLOAD_FIELDS },
    async handler({ req, res, db }) {
      const { files, meta, options, onConflict, notes } = await readUpload(req);
      refuseDemoImport(db, "page");
      const reports = importFiles(db, files, options, meta, onConflict);
      res.status(reports.every((r) => r.status === "rejected") ? 422 : 200);
      return { files: reports, notes };
    },
  }),
  defineRoute({
    method: "get",
    path: "/api/imports",
    tag: "imports",
    summary: "List imported files with their embryos, profiles and warnings",
    handler: ({ db }) => ({ imports: listImports(db) }),
  }),
  defineRoute({
    method: "delete",
    path: "/api/imports/:id",
    tag: "imports",
    summary: "Delete one import and exactly what it did: its profiles and fits, embryos left empty, and every value it changed on embryos stored before it is put back",
    params: IdParams,
    handler({ db, params }) {
      const deleted = deleteImport(db, params.id);
      if (!deleted) throw new UserError("unknown-import", `No import with id ${params.id}.`, { status: 404 });
      return { deleted };
    },
  }),
];
