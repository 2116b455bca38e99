/** The public issuance payloads are defined once, in shared/contracts/issuances.ts. */
export { archiveEntrySchema, issuanceSchema, type ArchiveEntry, type Issuance, type IssuanceEvidence, type IssuanceSnapshot } from '../../../../shared/contracts/issuances';
