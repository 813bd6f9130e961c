import type { UploadProgress } from '../../../api/upload.ts';
import { ProgressBar } from '../../../components/ui/progress-bar.tsx';
import { formatBytes } from '../../../lib/format-bytes.ts';

/** Sending (measured by bytes), then waiting for the server's answer (no measure). */
export function UploadProgressBar({ progress, sending, working }: { progress: UploadProgress | null; sending: string; working: string }) {
  const total = progress?.total ?? null;
  const sent = progress && total !== null && progress.loaded >= total;
  if (sent || !progress) return <ProgressBar label={sent ? working : sending} />;
  const share = total ? progress.loaded / total : undefined;
  const detail =
    share === undefined
      ? `${formatBytes(progress.loaded)} sent`
      : `${Math.round(share * 100)} % · ${formatBytes(progress.loaded)} of ${formatBytes(total!)}`;
  return <ProgressBar label={sending} value={share} detail={detail} />;
}
