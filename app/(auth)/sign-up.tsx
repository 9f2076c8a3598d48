import { SignUpScreen } from '@/features/auth';

export default SignUpScreen;
