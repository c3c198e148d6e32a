import type { ReactNode } from 'react';
import { browserCanShow, uploadUrl } from '../../lib/uploads/views';

interface Props {
  photo: { id: string; originalName: string; contentType: string };
  /** Under the picture: a delete button, a tick box, a note. */
  children?: ReactNode;
}

/** One uploaded photo as a square tile that opens the full picture; HEIC files (which most browsers cannot draw) as a labelled link. */
export function PhotoTile({ photo, children }: Props) {
  const url = uploadUrl(photo.id);
  return (
    <figure className="w-36 overflow-hidden rounded-lg border border-steel-200 bg-white" data-testid="photo-tile">
      <a href={url} target="_blank" rel="noopener" className="block" aria-label={`Open ${photo.originalName}`}>
        {browserCanShow(photo.contentType) ? (
          <img src={url} alt={photo.originalName} loading="lazy" className="h-36 w-36 bg-steel-100 object-cover" />
        ) : (
          <span className="flex h-36 w-36 flex-col items-center justify-center gap-1 bg-steel-100 p-2 text-center text-sm text-steel-700">
            <span aria-hidden="true" className="text-2xl">
              ▣
            </span>
            HEIC photo: open to view
          </span>
        )}
      </a>
      <figcaption className="truncate px-2 py-1 text-xs text-steel-600" title={photo.originalName}>
        {photo.originalName}
      </figcaption>
      {children}
    </figure>
  );
}
