import { runCli } from "../../server/cli/main.ts";

/** Run the command line in-process, capturing stdout and stderr. */
export async function runCliInProcess(args: string[], env: NodeJS.ProcessEnv = {}, cwd = process.cwd()) {
  let stdout = "";
  let stderr = "";
  const code = await runCli(args, {
    stdout: (t) => (stdout += t),
    stderr: (t) => (stderr += t),
    stderrIsTty: false,
    env,
    cwd,
  });
  return { code, stdout, stderr };
}
