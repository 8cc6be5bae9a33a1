"use strict";
// Demo accounts, one per role, for the invented scenario of the README. Passwords are for demos only.
const bcrypt = require("bcryptjs");
const { randomUUID } = require("crypto");

const DEMO_PASSWORD = "wavesieve-demo";
const people = [
  { email: "admin@wavesieve.test", name: "Ada Admin", role: "admin" },
  { email: "curator@wavesieve.test", name: "Cyril Curator", role: "curator" },
  { email: "researcher@wavesieve.test", name: "Rhea Researcher", role: "researcher" },
  { email: "viewer@wavesieve.test", name: "Vik Viewer", role: "viewer" },
];

module.exports = {
  async up(queryInterface) {
    const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
    const now = new Date();
    await queryInterface.bulkInsert(
      "users",
      people.map((p) => ({
        id: randomUUID(), email: p.email, name: p.name, role: p.role, password_hash: hash,
        disabled: false, failed_sign_ins: 0, notify_batch_done: true, notify_digest: true,
        created_at: now, updated_at: now,
      })),
    );
  },
  async down(queryInterface) {
    await queryInterface.bulkDelete("users", { email: people.map((p) => p.email) });
  },
};
