import type { RouteDefinition } from "../route.ts";
import { datasetRoutes } from "./datasetRoutes.ts";
import { exportRoutes } from "./exportRoutes.ts";
import { figureRoutes } from "./figureRoutes.ts";
import { fitRoutes } from "./fitRoutes.ts";
import { groupRoutes } from "./groupRoutes.ts";
import { importRoutes } from "./importRoutes.ts";
import { jobRoutes } from "./jobRoutes.ts";
import { precisionRoutes } from "./precisionRoutes.ts";
import { profileRoutes } from "./profileRoutes.ts";

/** Every API route, in the order the reference lists them. */
export const ALL_ROUTES: RouteDefinition[] = [...datasetRoutes, ...importRoutes, ...profileRoutes, ...fitRoutes, ...precisionRoutes, ...groupRoutes, ...jobRoutes, ...figureRoutes, ...exportRoutes];
