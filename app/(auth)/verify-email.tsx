import { VerifyEmailScreen } from '@/features/auth';

export default VerifyEmailScreen;
