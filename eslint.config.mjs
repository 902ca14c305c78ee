import next from "eslint-config-next";

const config = [
  ...next,
  {
    ignores: [
      "node_modules/**",
      ".next*/**",
      ".data/**",
      "db/migrations/**",
      "test-results/**",
      "playwright-report/**",
    ],
  },
];

export default config;
