/**
 * Version of the numeric engine, stored with every fit and analysis so that a
 * result can be traced to the code that computed it. Bump when a change alters numbers.
 */
export const ENGINE_VERSION = "morphogauge-engine 0.1.0";
