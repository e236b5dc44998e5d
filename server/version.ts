import packageJson from "../package.json" with { type: "json" };

/** The tool's version: package.json is its one source (the CLI, the API and reports all read it here). */
export const TOOL_VERSION: string = packageJson.version;

/**
 * Version of the numeric engine, stored with every fit and analysis so that a
 * result can be traced to the code that computed it. It follows the tool's version;
 * bump package.json's version when a change alters numbers.
 */
export const ENGINE_VERSION = `morphogauge-engine ${TOOL_VERSION}`;
