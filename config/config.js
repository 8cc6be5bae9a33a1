// Database settings for sequelize-cli (migrations, seeders). The app reads the same variables in lib/db.ts.
const path = require("path");

function settings() {
  if (process.env.DATABASE_URL && !process.env.DATABASE_URL.startsWith("sqlite:")) {
    return { url: process.env.DATABASE_URL, logging: false, seederStorage: "sequelize" };
  }
  const fromUrl = process.env.DATABASE_URL ? process.env.DATABASE_URL.replace(/^sqlite:(\/\/)?/, "") : "";
  const storage = process.env.DATABASE_PATH || fromUrl || path.resolve("data", "wavesieve.sqlite");
  return { dialect: "sqlite", storage, logging: false, seederStorage: "sequelize" };
}

const base = settings();
module.exports = { development: base, test: base, production: base };
