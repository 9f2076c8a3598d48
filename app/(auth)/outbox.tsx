import { OutboxScreen } from '@/features/outbox';

export default OutboxScreen;
