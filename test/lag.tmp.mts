let worst = 0; let last = performance.now();
const tick = setInterval(() => { const now = performance.now(); worst = Math.max(worst, now - last - 10); last = now; }, 10);
await new Promise((r) => setTimeout(r, 8000));
clearInterval(tick);
console.log("idle worst lag", worst);
