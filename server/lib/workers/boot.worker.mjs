// The entry of every worker pool (pool.ts): plain JavaScript, so a worker thread can start it with no
// loader; it registers tsx, then loads the TypeScript module the pool names in its workerData.
import { register } from "tsx/esm/api";
import { workerData } from "piscina";

register();
const mod = await import(workerData.module);
export default mod.default;
