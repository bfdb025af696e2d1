import * as THREE from 'three';

/**
 * Named camera views. The display geometry is Y up with IFC x → east (+x) and IFC y →
 * north (−z); "north" is the model's own (project) north, not true north.
 */
export const VIEWS = [
  { name: 'south-east', label: 'From south-east', key: '1' },
  { name: 'north-west', label: 'From north-west', key: '2' },
  { name: 'plan', label: 'Plan', key: '3' },
  { name: 'north', label: 'North elevation', key: '4' },
  { name: 'east', label: 'East elevation', key: '5' },
] as const;
export type ViewName = (typeof VIEWS)[number]['name'];

/** Unit vector from the target towards the camera. */
export function cameraPose(view: ViewName): THREE.Vector3 {
  switch (view) {
    case 'south-east':
      return new THREE.Vector3(1, 0.75, 1).normalize();
    case 'north-west':
      return new THREE.Vector3(-1, 0.75, -1).normalize();
    case 'plan':
      // Straight down would leave "up" undefined; a hair to the south keeps north at the top.
      return new THREE.Vector3(0, 1, 0.001).normalize();
    case 'north':
      return new THREE.Vector3(0, 0.02, -1).normalize();
    case 'east':
      return new THREE.Vector3(1, 0.02, 0).normalize();
  }
}
