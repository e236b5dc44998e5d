// Worker-thread entry: registers the TypeScript loader in this thread, then loads the worker.
import { register } from "tsx/esm/api";

register();
await import("./jobWorker.ts");
