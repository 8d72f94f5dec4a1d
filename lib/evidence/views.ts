import type { CaseFile } from '@/db/files';
import type { User } from '@/db/types';
import type { CaseAccess } from '@/lib/hunt/access';
import { fileAccess } from '@/lib/hunt/access';

/** A file as the API shows it to one user. */
export type FileView = {
  id: string;
  name: string;
  size: number;
  kind: CaseFile['kind'];
  contentType: string | null;
  uploadedBy: { id: string | null; name: string | null };
  createdAt: string;
  analysis: CaseFile['analysis'];
  contentUrl: string;
  thumbnailUrl: string | null;
  can: { delete: boolean };
};

export function toFileView(me: User, access: CaseAccess, f: CaseFile): FileView {
  const base = `/api/cases/${f.caseId}/files/${f.id}`;
  return {
    id: f.id,
    name: f.name,
    size: f.size,
    kind: f.kind,
    contentType: f.contentType,
    uploadedBy: { id: f.uploadedBy, name: f.uploaderName },
    createdAt: new Date(f.createdAt).toISOString(),
    analysis: f.analysis,
    contentUrl: `${base}/content`,
    thumbnailUrl: f.kind === 'photo' && f.thumbKey ? `${base}/thumbnail` : null,
    can: { delete: fileAccess(me, access, f).delete },
  };
}
