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
import { backupCommand } from "./backupCommand.ts";
import { restoreCommand } from "./restoreCommand.ts";

/** Every sub-command, in the order the help lists them. */
export const COMMANDS: Command[] = [importCommand, listCommand, demoCommand, fitCommand, precisionCommand, compareCommand, trackCommand, planCommand, reportCommand, serveCommand, backupCommand, restoreCommand];
