// Metro for the web target. In `npm run dev` the Expo dev server answers the app and forwards
// /api to the API server, so the client uses same-origin URLs in development and production.
const { getDefaultConfig } = require('expo/metro-config');
const { createProxyMiddleware } = require('http-proxy-middleware');
const path = require('node:path');

const config = getDefaultConfig(__dirname);

const escape = (dir) => path.join(__dirname, dir).replace(/[/\\]/g, '[/\\\\]');
config.resolver.blockList = [new RegExp(`${escape('data')}[/\\\\].*`), new RegExp(`${escape('tests/artifacts')}[/\\\\].*`)];

const apiTarget = process.env.API_URL ?? `http://localhost:${process.env.PORT ?? 8080}`;
const apiProxy = createProxyMiddleware({ target: apiTarget, changeOrigin: false, xfwd: true });

config.server = {
  ...config.server,
  enhanceMiddleware: (metroMiddleware) => (req, res, next) =>
    req.url && req.url.startsWith('/api/') ? apiProxy(req, res, next) : metroMiddleware(req, res, next),
};

module.exports = config;
