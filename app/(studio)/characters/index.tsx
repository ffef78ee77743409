import { useState } from 'react';
import { Screen } from '../../../components/layout/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';
import { Button } from '../../../components/ui/Button';
import { Notice } from '../../../components/ui/Notice';
import { CharacterList } from '../../../components/characters/CharacterList';
import { UploadPanel } from '../../../components/characters/UploadPanel';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { useCan } from '../../../hooks/useCan';
import { useCharacters, useUploadCharacter } from '../../../hooks/useCharacters';

export default function CharactersScreen() {
  const characters = useCharacters();
  const mayUpload = useCan('characters.upload');
  const upload = useUploadCharacter();
  const [uploading, setUploading] = useState(false);
  const list = characters.data?.characters ?? [];
  return (
    <Screen
      title="Characters"
      lede="Your studio's rigged characters, their legs and their leg setups."
      actions={mayUpload ? <Button label={uploading ? 'Close upload' : 'Upload character'} tone={uploading ? 'quiet' : 'action'} onPress={() => {
            // A closed panel starts afresh next time, as before the upload moved up to this screen.
            if (uploading) upload.reset();
            setUploading(!uploading);
          }} /> : null}
    >
      {uploading && mayUpload ? <UploadPanel upload={upload} /> : null}
      {characters.isPending ? <LoadingPage /> : null}
      {characters.isError ? <Notice message={characters.error.message} /> : null}
      {characters.isSuccess && list.length === 0 ? (
        <EmptyState
          heading="Bring your first character"
          body={mayUpload ? 'Upload a .glb or .gltf with a skin. Treadle reads its skeleton, finds the legs and lets you correct the mapping.' : 'An owner or designer uploads characters; they will show here.'}
          points={['Import report with any validation problems', 'Detected legs with their joints and limits', 'A 3D view you can orbit by touch']}
        />
      ) : null}
      {list.length ? <CharacterList characters={list} /> : null}
    </Screen>
  );
}
