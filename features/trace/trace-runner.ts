export { createMainThreadTraceRunner as createTraceRunner, type TraceRunner } from './trace-main-thread';
