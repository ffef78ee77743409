import { Screen } from '../../../components/layout/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';

export default function CharactersScreen() {
  return (
    <Screen title="Characters" lede="Your studio's rigged characters, their legs and their leg setups.">
      <EmptyState
        heading="Bring your first character"
        body="Upload a .glb or .gltf with a skin. Treadle reads its skeleton, finds the legs and lets you correct the mapping."
        points={['Import report with any validation problems', 'Detected legs with their joints and limits', 'A 3D view you can orbit by touch']}
      />
    </Screen>
  );
}
