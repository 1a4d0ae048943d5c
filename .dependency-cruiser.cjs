/**
 * The house's boundaries, checked by dependency-cruiser on every `npm test` (with lint).
 * The client's feature rule is also an ESLint rule (it shows in the editor); the server's are here.
 */
module.exports = {
  forbidden: [
    {
      name: 'no-circular',
      severity: 'error',
      comment: 'No import circle anywhere: each module can be read after the ones it uses.',
      from: {},
      to: { circular: true },
    },
    {
      name: 'shared-core-is-pure',
      severity: 'error',
      comment: 'src/shared (the pure core and the contract) imports nothing of the client, the server or the scripts.',
      from: { path: '^src/shared/' },
      to: { path: '^(server|scripts|fakes|tests|src/(?!shared/))' },
    },
    {
      name: 'platform-knows-no-domain',
      severity: 'error',
      comment: 'server/platform is what every domain uses; it uses none of them.',
      from: { path: '^server/platform/' },
      to: { path: '^server/(?!platform/)' },
    },
    {
      name: 'domains-meet-at-services',
      severity: 'error',
      comment: "A domain may call another domain's service (its story), never its routes, repos, presenters or helpers.",
      from: { path: '^server/([^/]+)/' },
      to: { path: '^server/(?!platform/|$1/)[^/]+/', pathNot: '\\.service\\.ts$' },
    },
    {
      name: 'routes-hold-no-queries',
      severity: 'error',
      comment: 'A routes file parses, authorises, calls a service and presents: no Knex, no repo.',
      from: { path: '\\.routes\\.ts$' },
      to: { path: '(\\.repo\\.ts$|node_modules/knex/)' },
    },
    {
      name: 'features-stand-alone',
      severity: 'error',
      comment: 'A client feature does not import another; routes in src/app assemble them.',
      from: { path: '^src/features/([^/]+)/' },
      to: { path: '^src/features/(?!$1/)' },
    },
    {
      name: 'client-never-imports-server',
      severity: 'error',
      from: { path: '^src/' },
      to: { path: '^(server|scripts|fakes)/' },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    exclude: { path: '(^dist/|^\\.data/|node_modules)' },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    enhancedResolveOptions: { exportsFields: ['exports'], conditionNames: ['import', 'require', 'node', 'default', 'types'], extensions: ['.ts', '.tsx', '.js', '.mjs', '.cjs'] },
    moduleSystems: ['es6', 'cjs'],
  },
};
