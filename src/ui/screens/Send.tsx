import { createBackup } from '../../store/backup';
import { downloadText } from '../download';

export function SendScreen() {
  return (
    <section>
      <p class="lead">Send the day's records to the office once you have signal. Nothing leaves the phone until you say so.</p>
      <p class="muted">CSV export and the upload queue are being built. Meanwhile a full backup keeps everything safe.</p>
      <button type="button" class="btn btn-block" onClick={async () => downloadText(`bankside-backup-${new Date().toISOString().slice(0, 10)}.json`, JSON.stringify(await createBackup()), 'application/json')}>
        Download a full backup
      </button>
    </section>
  );
}
