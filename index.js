// The app's entry point. Expo Router's own entry comes second so that the line before it runs
// before any of the app's modules (see features/api/zod-jitless.js).
import './features/api/zod-jitless';
import 'expo-router/entry';
