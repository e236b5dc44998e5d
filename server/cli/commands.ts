import type { Command } from "./command.ts";
import { demoCommand } from "./demoCommand.ts";
import { fitCommand } from "./fitCommand.ts";
import { precisionCommand } from "./precisionCommand.ts";
import { compareCommand } from "./compareCommand.ts";
import { trackCommand } from "./trackCommand.ts";
import { planCommand } from "./planCommand.ts";
import { importCommand } from "./importCommand.ts";
import { listCommand } from "./listCommand.ts";
import { reportCommand } from "./reportCommand.ts";
import { serveCommand } from "./serveCommand.ts";
import { fitsCommand } from "./fitsCommand.ts";
import { excludeCommand, exclusionsCommand, includeCommand } from "./excludeCommand.ts";

/** Every sub-command, in the order the help lists them. */
export const COMMANDS: Command[] = [importCommand, listCommand, demoCommand, fitCommand, fitsCommand, excludeCommand, includeCommand, exclusionsCommand, precisionCommand, compareCommand, trackCommand, planCommand, reportCommand, serveCommand];
