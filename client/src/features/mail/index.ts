// What the rest of the app may use from the mail feature (the outbox, sending results by mail).
export { OutboxList } from './components/outbox-list';
export { OutboxMessage } from './components/outbox-message';
export { useOutboxMessage } from './api/use-outbox';
export { SendCriticalForm } from './components/send-critical-form';
