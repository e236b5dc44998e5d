import { PrecisionRequest } from "../../services/precision/precisionRequest.ts";
import { preparePrecisionInput, storePrecisionOutput } from "../../services/precision/precisionService.ts";
import type { PrecisionGroupOutput } from "../../services/precision/precisionTask.ts";
import { defineRoute } from "../route.ts";

export const precisionRoutes = [
  defineRoute({
    method: "post",
    path: "/api/precision",
    tag: "precision",
    summary: "Start a positional-precision analysis (a background job with progress; poll /api/jobs/{id})",
    description:
      "Positional error σ_x(x) = σ_c(x)/|dc̄/dx| with a bootstrap band over embryos, boundary variability, positional information (small-noise and direct) and a decoding map, per genotype. The result states the normalisation and derivative used.",
    body: PrecisionRequest,
    status: 202,
    handler({ db, jobs, body }) {
      const input = preparePrecisionInput(db, body);
      return jobs.submit("precision", input, (output) => storePrecisionOutput(db, input, output as PrecisionGroupOutput[]));
    },
  }),
];
