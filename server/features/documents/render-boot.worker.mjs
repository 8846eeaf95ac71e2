// The render pool's worker entry: plain JavaScript, so a worker thread can start it with no loader;
// it registers tsx, then loads the TypeScript worker (render.worker.ts).
import { register } from "tsx/esm/api";

register();
const { default: render } = await import("./render.worker.ts");
export default render;
