import { SignInScreen } from '@/features/auth';

export default SignInScreen;
