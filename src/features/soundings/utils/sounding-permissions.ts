import type { Role } from '../../../../shared/contracts/common';
import { authoringRoles, hasRole } from '../../../../shared/workflow/roles';

/** Who may delete a sounding (the server checks the same): its uploader, or any lead. */
export function canDeleteSounding(viewer: { id: string; role: Role }, sounding: { uploadedBy: string | null }): boolean {
  switch (viewer.role) {
    case 'lead':
      return true;
    case 'forecaster':
      return sounding.uploadedBy !== null && sounding.uploadedBy === viewer.id;
    case 'admin':
    case 'subscriber':
      return false;
  }
}

/** Upload and what-if saving: forecasters and leads. */
export function canWriteSoundings(role: Role): boolean {
  return hasRole(role, authoringRoles);
}
