export { LandingScreen } from './components/landing-screen';
export { NotFoundScreen } from './components/not-found-screen';
