import type { Db } from "../../db/connection.ts";
import { demoFrapFiles, loadDynamicsDemo } from "../../server/services/demoData.ts";
import { FrapRequest, SimulateRequest, TimeCourseRequest } from "../../server/services/dynamics/dynamicsRequests.ts";
import { prepareFrap, runFrapTask, storeFrap } from "../../server/services/dynamics/frapService.ts";
import { simulateBuildUp } from "../../server/services/dynamics/simulateService.ts";
import { prepareTimeCourse, runTimeCourseTask, storeTimeCourse } from "../../server/services/dynamics/timeCourseService.ts";

/** One stored build-up fit, FRAP analysis and simulation on the demo dynamics data (small settings). */
export function seedDynamics(db: Db) {
  loadDynamicsDemo(db);
  const tc = prepareTimeCourse(db, TimeCourseRequest.parse({ selection: { channel: "glm-gfp" }, options: { profilePoints: 7 } }));
  const timeCourse = storeTimeCourse(db, tc, runTimeCourseTask(tc)).groups[0];
  const fr = prepareFrap(FrapRequest.parse({ files: demoFrapFiles(), options: { geometry: { kind: "spot", radiusUm: 3 } } }));
  const frap = storeFrap(db, fr, runFrapTask(fr));
  const simulation = simulateBuildUp(SimulateRequest.parse({ diffusionUm2PerS: 0.3, degradationPerS: 2e-4, lengthUm: 300, untilS: 7200, profiles: 3, cells: 100 }), db);
  return { timeCourse, frap, simulation };
}
