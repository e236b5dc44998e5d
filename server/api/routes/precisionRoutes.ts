import { PrecisionRequest } from "../../services/precision/precisionRequest.ts";
import { preparePrecisionInput, storePrecisionOutput } from "../../services/precision/precisionService.ts";
import type { PrecisionGroupOutput } from "../../services/precision/precisionTask.ts";
import { precisionWork } from "../../services/jobWork.ts";
import { defineRoute } from "../route.ts";
import { submitJob } from "../submitJob.ts";

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
    handler(ctx) {
      const input = preparePrecisionInput(ctx.db, ctx.body);
      return submitJob<PrecisionGroupOutput[]>(ctx, "precision", input, {
        profileIds: input.groups.flatMap((g) => g.channels.flatMap((c) => c.profileIds)),
        work: precisionWork(input),
        store: (output) => storePrecisionOutput(ctx.db, input, output),
      });
    },
  }),
];
