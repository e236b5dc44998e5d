/** The host name of a Host header or URL authority, lower-cased and without port or IPv6 brackets. */
export function hostName(authority: string): string {
  const a = authority.trim().toLowerCase();
  if (a.startsWith("[")) return a.slice(1, a.indexOf("]") > 0 ? a.indexOf("]") : undefined);
  const colons = a.split(":").length - 1;
  return colons === 1 ? a.slice(0, a.indexOf(":")) : a;
}

/** Names and addresses that always mean this machine. */
export function isLoopbackName(name: string): boolean {
  return name === "localhost" || name.endsWith(".localhost") || /^127(\.\d{1,3}){3}$/.test(name) || name === "::1";
}

/** True for an address that only this machine can reach (127.0.0.0/8, ::1, localhost). */
export function isLoopbackAddress(host: string): boolean {
  return isLoopbackName(hostName(host.includes(":") && !host.startsWith("[") ? `[${host}]` : host));
}
