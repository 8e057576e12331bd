/// The version stored with every cell, so a result can be traced to the engine that made it.
import pkg from "@/package.json";

export const ENGINE_VERSION = `ringside-engine ${pkg.version}`;
