"use strict";
// The demo scenario: examples/ submitted as the demo researcher and screened (lib/demo/seed-scenario.ts).
// Skipped when DEMO_SCENARIO=0 (tests that want only the demo users).

module.exports = {
  async up() {
    if (process.env.DEMO_SCENARIO === "0") return;
    require("tsx/cjs");
    const { seedDemoScenario } = require("../lib/demo/seed-scenario.ts");
    await seedDemoScenario();
  },
  async down() {},
};
