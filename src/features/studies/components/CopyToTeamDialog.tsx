import { useState } from 'react';
import { useNavigate } from 'react-router';
import { SelectField } from '#src/components/SelectField';
import { paths } from '#src/lib/paths';
import { useMe } from '#src/lib/session';
import { useCopyStudy } from '../api/copy-study';
import { TitleDialog } from './TitleDialog';

/** The other teams the signed-in user may add studies to (owner or editor). */
export function useWritableTeams(exceptTeamId: string) {
  const me = useMe();
  return (me.data?.teams ?? []).filter((t) => t.id !== exceptTeamId && (t.role === 'owner' || t.role === 'editor'));
}

/**
 * "Copy to my team": a copy of the study (and of the team maps it uses) into another team the
 * user may write in, opened there. The original and its team are unchanged.
 */
export function CopyToTeamDialog({
  open,
  teamId,
  studyId,
  studyTitle,
  onClose,
}: {
  open: boolean;
  teamId: string;
  studyId: string;
  studyTitle: string;
  onClose: () => void;
}) {
  const navigate = useNavigate();
  const teams = useWritableTeams(teamId);
  const copy = useCopyStudy(teamId, studyId);
  const [picked, setTarget] = useState<string | null>(null);
  // The first team until one is picked (and again if the picked one is no longer writable).
  const target = teams.some((t) => t.id === picked) ? picked! : (teams[0]?.id ?? '');

  return (
    <TitleDialog
      open={open}
      title="Copy to my team"
      description="A copy of the last saved revision goes into a team where you can change it, with the team maps its plans use. The original stays as it is."
      initialTitle={studyTitle}
      submitLabel="Copy and open"
      onSubmit={async (title) => {
        const study = await copy.mutateAsync({ teamId: target, title });
        navigate(paths.teamStudy.href(study.teamId, study.id));
      }}
      onClose={onClose}
    >
      <SelectField
        label="Into the team"
        name="team"
        value={target}
        onChange={(e) => setTarget(e.target.value)}
        options={teams.map((t) => ({ value: t.id, label: t.personal ? `${t.name} (personal)` : t.name }))}
      />
    </TitleDialog>
  );
}
