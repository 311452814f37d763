import coreWebVitals from 'eslint-config-next/core-web-vitals';
import typescript from 'eslint-config-next/typescript';

const config = [
  ...coreWebVitals,
  ...typescript,
  { ignores: ['node_modules/**', '.next/**', '.next-bench/**', 'next-env.d.ts'] },
  // Tests read arbitrary JSON bodies; typing each one would add noise, not safety.
  { files: ['tests/**'], rules: { '@typescript-eslint/no-explicit-any': 'off' } },
  // A CommonJS file (the scripts' --require preload) can only load modules with require().
  { files: ['**/*.cjs'], rules: { '@typescript-eslint/no-require-imports': 'off' } },
];

export default config;
