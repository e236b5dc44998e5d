export {};
const app = document.getElementById("app");
if (app) {
  const health = await fetch("api/health").then((r) => r.json());
  app.textContent = health.ok ? "morphogauge is running." : "The server did not answer.";
}
