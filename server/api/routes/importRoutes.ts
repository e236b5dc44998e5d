import { z } from "zod";
import { deleteImport, listImports } from "../../../db/imports.ts";
import { ImportOptions } from "../../import/importOptions.ts";
import { parseProfileFile } from "../../import/parseProfileFile.ts";
import { importFiles } from "../../services/importFiles.ts";
import { isUserError, UserError } from "../../userError.ts";
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
  const options = ImportOptions.parse(fields.data);
  const files = body.files.files ?? [];
  if (files.length === 0) throw new UserError("no-files", 'No file was uploaded: send at least one file in the "files" field.', { status: 400 });
  const meta = body.files.meta?.[0];
  return { files, meta, options };
}

export const importRoutes = [
  defineRoute({
    method: "post",
    path: "/api/imports/preview",
    tag: "imports",
    summary: "Parse uploaded files without storing anything",
    description: "Shows the detected shape, separator, decimal mark, column roles and units, embryos and warnings, or the reasons a file would be rejected.",
    multipart: { fields: UPLOAD_FIELDS },
    async handler({ req }) {
      const { files, meta, options } = await readUpload(req);
      return {
        files: files.map((f) => {
          try {
            const p = parseProfileFile(f, options, meta);
            return {
              file: f.name,
              status: "ok" as const,
              format: p.format,
              delimiter: p.delimiter,
              decimalMark: p.decimalMark,
              columns: p.columns,
              embryos: p.embryos.map((e) => ({
                label: e.label,
                genotype: e.genotype,
                lengthUm: e.lengthUm,
                profiles: p.profiles.filter((x) => x.embryo === e.label).map((x) => ({ channel: x.channel, timeS: x.timeS, points: x.positionsUm.length, positionUnit: x.positionUnit, flipped: x.flipped })),
              })),
              warnings: p.warnings,
              droppedCells: p.droppedCells.slice(0, 100),
            };
          } catch (e) {
            if (!isUserError(e)) throw e;
            return { file: f.name, status: "rejected" as const, error: { code: e.code, message: e.message, issues: e.issues } };
          }
        }),
      };
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/imports",
    tag: "imports",
    summary: "Import uploaded profile files (each file all-or-nothing)",
    multipart: { fields: UPLOAD_FIELDS },
    async handler({ req, res, db }) {
      const { files, meta, options } = await readUpload(req);
      const reports = importFiles(db, files, options, meta);
      res.status(reports.every((r) => r.status === "rejected") ? 422 : 200);
      return { files: reports };
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
    summary: "Delete one import and only what it added (its profiles and fits, and embryos left empty)",
    params: IdParams,
    handler({ db, params }) {
      const deleted = deleteImport(db, params.id);
      if (!deleted) throw new UserError("unknown-import", `No import with id ${params.id}.`, { status: 404 });
      return { deleted };
    },
  }),
];
