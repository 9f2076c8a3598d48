export { OutboxScreen } from './components/outbox-screen';
