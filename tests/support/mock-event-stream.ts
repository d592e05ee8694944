/**
 * A stand-in for the browser's EventSource that component tests drive: open, events, error.
 * Tests hand it to the API client mock as `openEventStream` and read `MockStream.all`.
 */
export class MockStream {
  static all: MockStream[] = [];
  onopen: (() => void) | null = null;
  onerror: (() => void) | null = null;
  closed = false;
  private listeners: Record<string, Array<(e: { data: string }) => void>> = {};
  constructor(readonly path: string) {
    MockStream.all.push(this);
  }
  addEventListener(name: string, f: (e: { data: string }) => void) {
    (this.listeners[name] ??= []).push(f);
  }
  close() {
    this.closed = true;
  }
  emit(name: string, data: unknown) {
    for (const f of this.listeners[name] ?? []) f({ data: JSON.stringify(data) });
  }
}
