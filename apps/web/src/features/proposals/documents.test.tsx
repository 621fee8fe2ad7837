import { act, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { json, makeSession, mockApi } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import { BASE, REFERENCE, makeProposal, noChecks } from './testing/fixtures';

const SLOW = { timeout: 10_000 };
const TEST_TIMEOUT = 30_000;

beforeEach(() => resetCsrfToken());

/** The one upload under way: the test moves its progress and decides its answer. */
class FakeUpload {
  static current: FakeUpload | null = null;
  upload: { onprogress: ((event: ProgressEvent) => void) | null } = { onprogress: null };
  onload: (() => void) | null = null;
  onerror: (() => void) | null = null;
  onabort: (() => void) | null = null;
  status = 0;
  statusText = '';
  responseText = '';
  method = '';
  url = '';
  form: FormData | null = null;

  open(method: string, url: string) {
    this.method = method;
    this.url = url;
  }
  setRequestHeader() {}
  getResponseHeader(name: string) {
    return name.toLowerCase() === 'content-type' ? 'application/json' : null;
  }
  send(form: FormData) {
    this.form = form;
    FakeUpload.current = this;
  }
  abort() {
    this.onabort?.();
  }
  progress(loaded: number, total: number) {
    this.upload.onprogress?.({ loaded, total, lengthComputable: true } as ProgressEvent);
  }
  answer(status: number, body: unknown) {
    this.status = status;
    this.responseText = JSON.stringify(body);
    this.onload?.();
  }
}

function setUp() {
  FakeUpload.current = null;
  vi.stubGlobal('XMLHttpRequest', FakeUpload);
  mockApi({
    'GET /api/auth/me': json(makeSession()),
    'GET /api/auth/csrf': json({ token: 't' }),
    [`GET ${BASE}`]: json(makeProposal()),
    [`GET ${BASE}/checks`]: json(noChecks),
  });
  renderRoute(`/proposals/${REFERENCE}/documents`);
}

const pdf = () => new File(['%PDF-1.7 a science case'], 'case.pdf', { type: 'application/pdf' });

describe('the Documents section', () => {
  it(
    'shows the upload’s progress, then the stored file’s details and download link',
    async () => {
      setUp();
      const input = await screen.findByLabelText('Upload the science case (PDF)', {}, SLOW);
      await userEvent.upload(input, pdf());

      await waitFor(() => expect(FakeUpload.current).not.toBeNull());
      const upload = FakeUpload.current!;
      expect(upload.url).toBe(`${BASE}/documents`);
      expect(upload.form?.get('version')).toBe('7');
      expect((upload.form?.get('file') as File).name).toBe('case.pdf');

      act(() => upload.progress(30, 100));
      expect(
        await screen.findByRole('progressbar', { name: 'Uploading case.pdf: 30 %' }),
      ).toBeInTheDocument();
      act(() => upload.progress(80, 100));
      expect(screen.getByText('80 %')).toBeInTheDocument();

      act(() =>
        upload.answer(
          200,
          makeProposal({
            version: 8,
            scienceCase: {
              id: 'd-1',
              filename: 'case.pdf',
              sizeBytes: 240_000,
              pages: 3,
              sha256: 'ab'.repeat(32),
              uploadedAt: '2027-01-10T11:00:00Z',
            },
          }),
        ),
      );
      expect(await screen.findByText('3 of at most 4')).toBeInTheDocument();
      expect(screen.getByText('234 KB')).toBeInTheDocument();
      expect(screen.getByRole('link', { name: /Download the science case/ })).toHaveAttribute(
        'href',
        `${BASE}/documents/science-case`,
      );
      expect(screen.queryByRole('progressbar')).not.toBeInTheDocument();
      expect(screen.getByLabelText('Replace the science case (PDF)')).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );

  it(
    'names the problem when the server refuses the file',
    async () => {
      setUp();
      const input = await screen.findByLabelText('Upload the science case (PDF)', {}, SLOW);
      await userEvent.upload(input, pdf());
      await waitFor(() => expect(FakeUpload.current).not.toBeNull());

      act(() =>
        FakeUpload.current!.answer(422, {
          statusCode: 422,
          code: 'SCIENCE_CASE_TOO_LONG',
          message: 'The science case has 6 pages; this call allows at most 4.',
        }),
      );
      const alert = await screen.findByRole('alert');
      expect(alert).toHaveTextContent('case.pdf was not accepted');
      expect(alert).toHaveTextContent('The science case has 6 pages; this call allows at most 4.');
    },
    TEST_TIMEOUT,
  );

  it(
    'refuses a file that is not a PDF before sending it',
    async () => {
      setUp();
      const input = await screen.findByLabelText('Upload the science case (PDF)', {}, SLOW);
      await userEvent.upload(
        input,
        new File(['hello'], 'case.docx', { type: 'application/msword' }),
        {
          applyAccept: false,
        },
      );
      expect(await screen.findByRole('alert')).toHaveTextContent(
        'case.docx is not a PDF; the science case must be one.',
      );
      expect(FakeUpload.current).toBeNull();
    },
    TEST_TIMEOUT,
  );
});
