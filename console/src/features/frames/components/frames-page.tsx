import { useEffect, useId, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { ApiProblem } from '@/lib/api';
import { problemMessage } from '@/lib/form-errors';
import { formatDateTime } from '@/lib/format';
import { useDeleteFrame, useFrames, useUploadFrame, type Frame } from '../api/frames';
import { checkFile, type PixelRect, type Size } from '../patch';
import { keepKeyAfter, nextAttempt, type UploadAttempt } from '../upload-key';
import { FrameResult } from './frame-result';
import { PatchPicker } from './patch-picker';

function UploadError({ error }: { error: unknown }) {
  if (error instanceof ApiProblem && error.status === 403) {
    return (
      <Notice tone="fault">
        <strong>Test-frame uploads aren’t in your studio’s plan.</strong>{' '}
        {error.problem.detail ?? ''} An owner can change the plan on the{' '}
        <Link to={paths.billing}>Billing</Link> page.
      </Notice>
    );
  }
  const fields = error instanceof ApiProblem ? (error.problem.errors ?? []) : [];
  return (
    <Notice tone="fault">
      {problemMessage(error)}
      {fields.length ? (
        <ul className="mt-1 list-disc pl-5">
          {fields.map((f, i) => {
            const name = f.field ?? f.path ?? '';
            return (
              <li key={i}>
                {FIELD_LABELS[name] ?? name}: {f.reason ?? f.message}
              </li>
            );
          })}
        </ul>
      ) : null}
    </Notice>
  );
}

/** The upload's multipart fields as this page names them. */
const FIELD_LABELS: Record<string, string> = {
  file: 'File',
  cameraKelvin: 'Camera white balance',
  patchX: 'Neutral patch',
  patchY: 'Neutral patch',
  patchWidth: 'Neutral patch',
  patchHeight: 'Neutral patch',
};

/** The server's range for the camera white balance (frames/upload-reader.ts): whole kelvin. */
const KELVIN_RANGE = [1500, 20000] as const;

/** An inline error for the white-balance box, or null when it is empty or fine. */
export function kelvinProblem(value: string): string | null {
  if (value.trim() === '') return null;
  const n = Number(value);
  if (!Number.isInteger(n) || n < KELVIN_RANGE[0] || n > KELVIN_RANGE[1])
    return `Enter whole kelvin from ${KELVIN_RANGE[0]} to ${KELVIN_RANGE[1]}, or leave it empty.`;
  return null;
}

/** JPEG starts FF D8 FF, PNG 89 50 4E 47 0D 0A 1A 0A (the formats' own signatures). */
export async function looksLikeImage(file: Blob): Promise<boolean> {
  const head = new Uint8Array(await file.slice(0, 8).arrayBuffer());
  const jpeg = head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff;
  const png = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((b, i) => head[i] === b);
  return jpeg || png;
}

/** The studio's plan as far as uploads go (composed by the app from the plan query). */
export interface FramesPlan {
  name: string;
  uploads: boolean;
}

export function FramesPage({ plan }: { plan?: FramesPlan }) {
  const inputId = useId();
  const upload = useUploadFrame();
  const frames = useFrames();
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<string | null>(null);
  const [natural, setNatural] = useState<Size | null>(null);
  const [patch, setPatch] = useState<PixelRect | null>(null);
  const [kelvin, setKelvin] = useState('');
  const [fileError, setFileError] = useState<string | null>(null);
  const [dragging, setDragging] = useState(false);
  const [result, setResult] = useState<Frame | null>(null);
  // The last upload that got no usable answer: retrying it sends its Idempotency-Key again.
  const unanswered = useRef<UploadAttempt | null>(null);
  const remove = useDeleteFrame();
  const [doomed, setDoomed] = useState<Frame | null>(null);
  const [deleteError, setDeleteError] = useState<string | null>(null);

  // The preview URL lives as long as it is shown; the old one is released when it changes.
  useEffect(() => {
    if (!preview) return;
    return () => URL.revokeObjectURL(preview);
  }, [preview]);

  const choose = async (chosen: File | undefined) => {
    if (!chosen) return;
    let problem = checkFile(chosen);
    if (!problem && !(await looksLikeImage(chosen)))
      problem = `“${chosen.name}” is named as an image but is not a JPEG or PNG inside.`;
    setFileError(problem);
    setResult(null);
    upload.reset();
    if (problem) return;
    setPatch(null);
    setNatural(null);
    setFile(chosen);
    setPreview(URL.createObjectURL(chosen));
  };

  const kelvinError = kelvinProblem(kelvin);
  const submit = () => {
    if (!file || kelvinError) return;
    const cameraKelvin = Number(kelvin);
    const attempt = nextAttempt(unanswered.current, {
      file,
      patch,
      cameraKelvin: kelvin && Number.isFinite(cameraKelvin) ? cameraKelvin : undefined,
    });
    unanswered.current = attempt;
    upload.mutate(attempt, {
      onSuccess: (frame) => {
        unanswered.current = null;
        setResult(frame);
      },
      onError: (error) => {
        if (!keepKeyAfter(error)) unanswered.current = null;
      },
    });
  };

  const confirmDelete = async () => {
    if (!doomed) return;
    setDeleteError(null);
    try {
      await remove.mutateAsync(doomed.id);
      if (result?.id === doomed.id) setResult(null);
      setDoomed(null);
    } catch (error) {
      setDeleteError(problemMessage(error));
    }
  };

  return (
    <div className="flex flex-col gap-6">
      <Card>
        {plan && !plan.uploads ? (
          <Notice tone="info">
            <strong>Test-frame uploads aren’t in the {plan.name} plan.</strong> An owner can change
            the plan on the <Link to={paths.billing}>Billing</Link> page; frames already uploaded
            stay listed below.
          </Notice>
        ) : (
          <label
            htmlFor={inputId}
            onDragOver={(event) => {
              event.preventDefault();
              setDragging(true);
            }}
            onDragLeave={() => setDragging(false)}
            onDrop={(event) => {
              event.preventDefault();
              setDragging(false);
              void choose(event.dataTransfer.files[0]);
            }}
            className={`flex cursor-pointer flex-col items-center justify-center gap-2 rounded-card border-2 border-dashed p-8 text-center has-focus-visible:outline-2 has-focus-visible:outline-offset-2 has-focus-visible:outline-focus ${dragging ? 'border-accent bg-raised' : 'border-edge-strong'}`}
          >
            <span className="text-lead font-medium">Drop a test frame here, or choose a file</span>
            <span className="text-small text-ink-muted">
              JPEG or PNG, up to 25 MB. Shoot a grey card or white wall under your key light.
            </span>
            <input
              id={inputId}
              type="file"
              accept="image/jpeg,image/png"
              className="sr-only"
              onChange={(event) => void choose(event.target.files?.[0])}
            />
          </label>
        )}
        {fileError ? (
          <Notice tone="fault" className="mt-3">
            {fileError}
          </Notice>
        ) : null}
      </Card>

      {preview ? (
        <Card aria-labelledby="patch-heading">
          <h2 id="patch-heading" className="text-title font-semibold">
            Mark the neutral patch
          </h2>
          <p className="mt-1 text-small text-ink-muted">
            Drag a rectangle over something that should be neutral grey or white. Leave it unmarked
            and the server looks for one itself.
          </p>
          <div className="mt-3">
            <PatchPicker
              src={preview}
              natural={natural}
              onNaturalSize={setNatural}
              patch={patch}
              onPatch={setPatch}
            />
          </div>
          <p role="status" className="mt-2 text-small tabular-nums">
            {patch
              ? `Patch: ${patch.width} × ${patch.height} px at (${patch.x}, ${patch.y})`
              : 'No patch marked: the server will find one.'}
          </p>
          <div className="mt-4 flex flex-wrap items-end gap-3">
            <TextField
              label="Camera white balance (K, optional)"
              type="number"
              min={KELVIN_RANGE[0]}
              max={KELVIN_RANGE[1]}
              step={1}
              value={kelvin}
              error={kelvinError ?? undefined}
              onChange={(event) => setKelvin(event.target.value)}
              hint="What the camera was set to; otherwise it is assumed."
            />
            {patch ? (
              <Button variant="secondary" onClick={() => setPatch(null)}>
                Clear patch
              </Button>
            ) : null}
            <Button onClick={submit} disabled={upload.isPending || !!kelvinError}>
              {upload.isPending ? 'Measuring…' : 'Upload and measure'}
            </Button>
          </div>
          {upload.isError ? (
            <div className="mt-3">
              <UploadError error={upload.error} />
            </div>
          ) : null}
        </Card>
      ) : null}

      {result ? <FrameResult frame={result} /> : null}

      {frames.data && frames.data.data.length ? (
        <section aria-labelledby="recent-frames-heading">
          <h2 id="recent-frames-heading" className="mb-3 text-title font-semibold">
            Recent frames
          </h2>
          <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            {frames.data.data.map((frame) => (
              <li key={frame.id} className="flex flex-col gap-1">
                <button
                  type="button"
                  onClick={() => setResult(frame)}
                  aria-pressed={result?.id === frame.id}
                  className={`w-full rounded-card border bg-panel p-2 text-left ${result?.id === frame.id ? 'border-accent outline-1 outline-accent' : 'border-edge'}`}
                >
                  <img
                    src={frame.thumbnailUrl}
                    alt=""
                    className="aspect-video w-full object-cover"
                  />
                  <span className="mt-1 block text-small">
                    {frame.fileName ?? 'frame'} ·{' '}
                    {frame.colour.cctKelvin ? `${Math.round(frame.colour.cctKelvin)} K` : '—'}
                  </span>
                  <span className="block text-caption text-ink-muted">
                    {formatDateTime(frame.createdAt)}
                  </span>
                </button>
                <Button
                  variant="secondary"
                  size="sm"
                  className="self-start"
                  aria-label={`Delete ${frame.fileName ?? 'frame'} (${formatDateTime(frame.createdAt)})`}
                  onClick={() => {
                    setDeleteError(null);
                    setDoomed(frame);
                  }}
                >
                  Delete
                </Button>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <ConfirmDialog
        open={doomed !== null}
        title={`Delete ${doomed?.fileName ?? 'this frame'}?`}
        description="This removes the frame, its thumbnail and its analysis for everyone in the studio. It cannot be undone."
        confirmLabel="Delete frame"
        pending={remove.isPending}
        error={deleteError}
        onClose={() => {
          setDoomed(null);
          setDeleteError(null);
        }}
        onConfirm={() => void confirmDelete()}
      />
    </div>
  );
}
