import { vi } from 'vitest';

/** One multipart request as the browser would send it. */
export interface SentUpload {
  method: string;
  url: string;
  fields: Record<string, string>;
  file: File | null;
  /** Answers it: upload progress to the end, then the status and JSON body. */
  respond: (status: number, body: unknown) => void;
  /** Reports upload progress without answering. */
  progress: (loadedBytes: number) => void;
  aborted: boolean;
}

export type UploadHandler = (request: SentUpload) => Promise<{ status: number; body: unknown } | 'hold'>;

/**
 * Stands in for the network at the browser's boundary (XMLHttpRequest), nothing else: the app's own upload code runs
 * as it does in the browser. A handler answers each request, or holds it so a test can watch progress or cancel.
 */
export function installFakeUploadServer(handler: UploadHandler) {
  const sent: SentUpload[] = [];

  class FakeXMLHttpRequest extends EventTarget {
    readonly upload = new EventTarget();
    status = 0;
    responseText = '';
    private method = 'GET';
    private url = '';
    private done = false;
    private request: SentUpload | null = null;

    open(method: string, url: string) {
      this.method = method;
      this.url = url;
    }
    setRequestHeader() {}
    getResponseHeader(): string | null {
      return null;
    }

    abort() {
      if (this.done) return;
      this.done = true;
      if (this.request) this.request.aborted = true;
      this.dispatchEvent(new Event('abort'));
    }

    send(body: FormData) {
      const fields: Record<string, string> = {};
      let file: File | null = null;
      for (const [name, value] of body.entries()) {
        if (typeof value === 'string') fields[name] = value;
        else file = value;
      }
      const progress = (loaded: number) => {
        const event = Object.assign(new Event('progress'), { loaded, total: file?.size ?? 0, lengthComputable: true });
        this.upload.dispatchEvent(event);
      };
      const respond = (status: number, answer: unknown) => {
        if (this.done) return;
        this.done = true;
        progress(file?.size ?? 0);
        this.upload.dispatchEvent(new Event('load'));
        this.status = status;
        this.responseText = JSON.stringify(answer);
        this.dispatchEvent(new Event('load'));
      };
      const request: SentUpload = {
        method: this.method,
        url: this.url,
        fields,
        file,
        respond,
        progress,
        aborted: false,
      };
      this.request = request;
      sent.push(request);
      void handler(request).then((answer) => {
        if (answer !== 'hold') respond(answer.status, answer.body);
      });
    }
  }

  vi.stubGlobal('XMLHttpRequest', FakeXMLHttpRequest);
  return { sent };
}
