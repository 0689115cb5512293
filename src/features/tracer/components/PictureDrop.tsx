import { useRef, useState } from 'react';
import { useNavigate } from 'react-router';
import { MAX_IMAGE_BYTES, MAX_IMAGE_PIXELS } from '#shared/tracer/image-header';
import { Alert } from '#src/components/Alert';
import { FileDrop } from '#src/components/FileDrop';
import { isApiError } from '#src/lib/api-client';
import { paths } from '#src/lib/paths';
import { useStartTrace } from '../api/start-trace';
import { nameFromFile, readPicture } from '../lib/read-picture';

/** Choose or drop a picture: checked here by its bytes, then uploaded, and a trace opens on it. */
export function PictureDrop({ teamId }: { teamId: string }) {
  const start = useStartTrace(teamId);
  const navigate = useNavigate();
  const [problem, setProblem] = useState<string | null>(null);
  const [reading, setReading] = useState<string | null>(null);
  const attempt = useRef(0);

  async function take(file: File) {
    const mine = ++attempt.current;
    setProblem(null);
    setReading(file.name);
    start.reset();
    let check;
    try {
      check = await readPicture(file);
    } catch {
      check = null;
    }
    if (mine !== attempt.current) return;
    setReading(null);
    if (check === null) return setProblem(`“${file.name}” could not be read from your computer. Choose it again.`);
    if (!check.ok) return setProblem(check.message);
    start.mutate(
      { file, name: nameFromFile(file.name) },
      {
        onSuccess: (draft) => navigate(paths.teamTracerDraft.href(teamId, draft.id)),
        onError: (error) => setProblem(isApiError(error) ? error.message : 'The picture could not be uploaded. Try again.'),
      },
    );
  }

  return (
    <div className="space-y-3">
      <FileDrop
        label={start.isPending ? 'Uploading…' : 'Choose a picture'}
        accept="image/png,image/jpeg,.png,.jpg,.jpeg"
        disabled={start.isPending}
        onFile={(file) => void take(file)}
      >
        or drop one here: a PNG or JPEG of a compressor or turbine map (a scan, a screenshot, a photo taken square on), up to {MAX_IMAGE_BYTES / 1024 / 1024} MB
        and {MAX_IMAGE_PIXELS / 1e6} megapixels. The file is checked by its content, not its name.
      </FileDrop>
      {reading && (
        <p role="status" className="text-sm text-ink-soft">
          Checking “{reading}”…
        </p>
      )}
      {problem && (
        <Alert tone="error" title="This picture cannot be traced.">
          <p>{problem}</p>
        </Alert>
      )}
    </div>
  );
}
