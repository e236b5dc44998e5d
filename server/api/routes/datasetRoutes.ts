import { z } from "zod";
import { getDatasetKind } from "../../../db/datasetKind.ts";
import { UserError } from "../../userError.ts";
import { defineRoute } from "../route.ts";

const DataSetView = z.object({
  id: z.string(),
  path: z.string(),
  kind: z.enum(["demo", "user"]),
  current: z.boolean(),
  exists: z.boolean(),
});
const DataSetsAnswer = z.object({ current: DataSetView, available: z.array(DataSetView), switchable: z.boolean() });

function single(kind: "demo" | "user") {
  const only = { id: "database", path: "", kind, current: true, exists: true };
  return { current: only, available: [only], switchable: false };
}

export const datasetRoutes = [
  defineRoute({
    method: "get",
    path: "/api/datasets",
    tag: "data sets",
    summary: "Which database is open (the invented demo or the lab's own) and which others the page can switch to",
    response: DataSetsAnswer,
    handler: ({ db, datasets }) => (datasets ? { current: datasets.current(), available: datasets.list(), switchable: true } : single(getDatasetKind(db))),
  }),
  defineRoute({
    method: "post",
    path: "/api/datasets/switch",
    tag: "data sets",
    summary: "Open another data set for the page (the demo is filled the first time it is opened)",
    body: z.object({ id: z.string().min(1).max(300) }),
    response: DataSetsAnswer,
    async handler({ datasets, body }) {
      if (!datasets) throw new UserError("one-database", "This server was started on one database only; start it with morphogauge serve to switch data sets.", { status: 409 });
      await datasets.switchTo(body.id);
      return { current: datasets.current(), available: datasets.list(), switchable: true };
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/datasets",
    tag: "data sets",
    summary: "Create a new, empty data set beside the lab's database file and open it",
    body: z.object({ name: z.string().min(1).max(64) }),
    response: DataSetsAnswer,
    status: 201,
    async handler({ datasets, body }) {
      if (!datasets) throw new UserError("one-database", "This server was started on one database only; start it with morphogauge serve to create data sets.", { status: 409 });
      await datasets.create(body.name);
      return { current: datasets.current(), available: datasets.list(), switchable: true };
    },
  }),
];
