// Metro for the web target. In `npm run dev` the Expo dev server answers the app and forwards
// /api to the API server, so the client uses same-origin URLs in development and production.
const { getDefaultConfig } = require('expo/metro-config');
const { createProxyMiddleware } = require('http-proxy-middleware');
const path = require('node:path');

const config = getDefaultConfig(__dirname);

const escape = (dir) => path.join(__dirname, dir).replace(/[/\\]/g, '[/\\\\]');
config.resolver.blockList = [
  new RegExp(`${escape('data')}[/\\\\].*`),
  new RegExp(`${escape('tests/artifacts')}[/\\\\].*`),
];

// Tree shaking for production exports (EXPO_UNSTABLE_TREE_SHAKING, set by the build script):
// ESM imports let Metro drop the parts of mathjs, d3 and zod the app never calls.
config.transformer = {
  ...config.transformer,
  getTransformOptions: async () => ({
    transform: { experimentalImportSupport: true, inlineRequires: false },
  }),
};

// zod's namespace export carries every locale (≈ 480 KB minified) because `z.locales` is a
// member of it and no bundler can drop one member of a namespace object. Blazebook writes its
// own messages and uses only English, so zod's locale index resolves to English alone.
const zodLocalesEnglish = path.join(__dirname, 'shared', 'zod-locales-en.js');
const resolveDefault = config.resolver.resolveRequest;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (
    moduleName === '../locales/index.js' &&
    /[/\\]node_modules[/\\]zod[/\\]v4[/\\]/.test(context.originModulePath)
  ) {
    return { type: 'sourceFile', filePath: zodLocalesEnglish };
  }
  return (resolveDefault ?? context.resolveRequest)(context, moduleName, platform);
};

const apiTarget = process.env.API_URL ?? `http://localhost:${process.env.PORT ?? 8080}`;
const apiProxy = createProxyMiddleware({ target: apiTarget, changeOrigin: false, xfwd: true });

config.server = {
  ...config.server,
  enhanceMiddleware: (metroMiddleware) => (req, res, next) =>
    req.url && req.url.startsWith('/api/') ? apiProxy(req, res, next) : metroMiddleware(req, res, next),
};

module.exports = config;
