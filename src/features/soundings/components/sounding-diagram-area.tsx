import { useNavigate } from 'react-router';
import { Notice } from '../../../components/ui/notice';
import type { SaveModifiedSoundingInput } from '../../../../shared/contracts/soundings';
import { useMe } from '../../../hooks/use-me';
import { useUnits } from '../../../hooks/use-units';
import { formFailureFrom } from '../../../utils/form';
import type { SoundingDetail } from '../api/get-sounding';
import { useSaveModifiedSounding } from '../api/save-modified-sounding';
import { SoundingWorkbench } from '../diagram';
import { canWriteSoundings } from '../utils/sounding-permissions';

/**
 * Hosts the diagram workbench for one stored sounding. Forecasters and leads get the what-if
 * editor with saving: the new modified sounding opens on its own page with a confirmation.
 */
export function SoundingDiagramArea({ sounding }: { sounding: SoundingDetail }) {
  const { units } = useUnits();
  const me = useMe();
  const navigate = useNavigate();
  const save = useSaveModifiedSounding();
  const mayWrite = me.data ? canWriteSoundings(me.data.user.role) : false;

  async function saveModified(input: SaveModifiedSoundingInput) {
    const saved = await save.mutateAsync({ soundingId: sounding.id, input });
    await navigate(`/soundings/${saved.id}`, { state: { savedModification: saved.modificationName ?? input.name } });
  }

  return (
    <div className="space-y-3">
      {save.isError ? (
        <Notice tone="error" title="The modified sounding was not saved">
          {formFailureFrom(save.error).message}
        </Notice>
      ) : null}
      <SoundingWorkbench
        levels={sounding.levels}
        units={units}
        readOnly={!mayWrite}
        modifiedLabel={sounding.modificationName}
        {...(mayWrite ? { onSaveModified: saveModified } : {})}
      />
    </div>
  );
}
