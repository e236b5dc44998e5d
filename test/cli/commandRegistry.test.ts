import { describe, expect, it } from "vitest";
import { COMMANDS } from "../../server/cli/commands.ts";

// The registry lists commands without loading them; its name and summary must be the command's own
// (common practice, no source).
describe("command registry", () => {
  for (const entry of COMMANDS) {
    it(`COMMANDS entry "${entry.name}" loads a command with the same name and summary`, async () => {
      const command = await entry.load();
      expect(command.name).toBe(entry.name);
      expect(command.summary).toBe(entry.summary);
    });
  }
});
