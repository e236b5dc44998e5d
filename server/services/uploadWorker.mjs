// Worker-thread entry: registers the TypeScript loader in this thread, then loads the upload reader.
import { register } from "tsx/esm/api";

register();
await import("./uploadWorker.ts");
