import { LandingScreen } from '@/features/landing';

export default LandingScreen;
