import nextCoreWebVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";

const config = [
  ...nextCoreWebVitals,
  ...nextTypescript,
  {
    ignores: [
      ".next/**",
      ".next-*/**",
      "node_modules/**",
      ".data/**",
      "tmp/**",
      ".stryker-tmp*/**",
      "drizzle/**",
      "next-env.d.ts",
    ],
  },
];

export default config;
