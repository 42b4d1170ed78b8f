// The import boundary between the client, the server and shared/, as lint rules (tests/unit/lint-boundaries.test.ts
// proves they fire). What both sides need lives in shared/. Relative paths are resolved (import/no-restricted-paths);
// Nuxt's aliases, which the resolver does not know, are matched by name (no-restricted-imports).
import { createNodeResolver } from 'eslint-plugin-import-x'

const CLIENT = ['pages', 'components', 'composables', 'stores', 'layouts', 'middleware', 'plugins', 'app.vue', 'error.vue']
const TO_SHARED = 'what both sides need lives in shared/'

const serverAlias = { regex: String.raw`^(~~|#server)/server/|^#server/|^~~/server$`, message: `The client never imports server/: ${TO_SHARED}.` }
const clientAliases = [
  { regex: String.raw`^~~/(pages|components|composables|stores|layouts|middleware|plugins)/`, message: `server/ and shared/ never import the client: ${TO_SHARED}.` },
  { regex: String.raw`^(~|@)/`, message: `~/ and @/ are the client's folders: server/ and shared/ never import them (${TO_SHARED}).` },
  { regex: String.raw`^#(app|components|build)(/|$)`, message: 'Nuxt\'s client modules are not available to server/ and shared/.' },
]

export default [
  {
    settings: { 'import-x/resolver-next': [createNodeResolver({ extensions: ['.ts', '.mts', '.mjs', '.js', '.vue', '.d.ts'] })] },
    rules: {
      'import/no-restricted-paths': ['error', {
        zones: [
          { target: CLIENT.map(d => `./${d}`), from: './server', message: `The client never imports server/: ${TO_SHARED}.` },
          { target: './server', from: CLIENT.map(d => `./${d}`), message: `server/ never imports the client: ${TO_SHARED}.` },
          { target: './shared', from: ['./server', ...CLIENT.map(d => `./${d}`)], message: 'shared/ is pure code both sides use: it imports neither server/ nor the client.' },
        ],
      }],
    },
  },
  { files: CLIENT.map(d => (d.endsWith('.vue') ? d : `${d}/**`)), rules: { 'no-restricted-imports': ['error', { patterns: [serverAlias] }] } },
  { files: ['server/**'], rules: { 'no-restricted-imports': ['error', { patterns: clientAliases }] } },
  { files: ['shared/**'], rules: { 'no-restricted-imports': ['error', { patterns: [serverAlias, ...clientAliases] }] } },
]
