export const ATTACHMENT_LABELS: Record<string, string> = {
  "t-hinge": "T-hinges",
  "v-hinge": "V-hinges (folded)",
  "pendant-hinge": "Pendant hinges",
  "pass-through-hinge": "Pass-through (S-) hinges",
  corners: "Corners",
  "edge-strips": "Edge strips",
  "sink-mount": "Sink mount",
  "polyester-straps": "Polyester straps",
  "pressure-sensitive-tape": "Pressure-sensitive tape",
};
export const ADHESIVE_LABELS: Record<string, string> = {
  "wheat-starch-paste": "Wheat starch paste",
  "rice-starch-paste": "Rice starch paste",
  "methyl-cellulose": "Methyl cellulose",
  none: "None",
  "pressure-sensitive": "Pressure-sensitive",
  other: "Other",
};
