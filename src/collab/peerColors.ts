// A colour per person, the same in every tab and on every machine (from the user id), picked
// from a set that stays readable on the light and the dark canvas.
const PALETTE = ['#c2410c', '#0f766e', '#7c3aed', '#be185d', '#1d4ed8', '#4d7c0f', '#b45309', '#0e7490'];

export function peerColor(userId: number): string {
  return PALETTE[Math.abs(userId) % PALETTE.length];
}

/** Up to two letters for an avatar: "Ada Lovelace" → "AL", "ben-demo" → "BE". */
export function initials(name: string): string {
  const words = name.split(/[\s._-]+/).filter(Boolean);
  const letters = words.length > 1 ? words[0][0] + words[1][0] : name.slice(0, 2);
  return letters.toUpperCase();
}
