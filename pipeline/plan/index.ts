export { loadPlan, sortProblems } from './load.ts';
export { nearest } from './suggest.ts';
export { formatPath } from './source.ts';
export type { PathSegment } from './source.ts';
export type { Registry, RegistryChart, RegistryMeasure } from './registry.ts';
export {
  castMemberSchema,
  exhibitSchema,
  ID_PATTERN,
  idSchema,
  noteAnchorSchema,
  noteSchema,
  panelSchema,
  PLAN_VERSION,
  planSchema,
  pronounSchema,
  RESERVED_ROOM_IDS,
  roomSchema,
  textSchema,
} from './schema.ts';
export type {
  CastMemberData,
  ExhibitData,
  NoteAnchor,
  NoteData,
  PanelData,
  PlanData,
  PlanInput,
  Pronoun,
  RoomData,
  TextData,
} from './schema.ts';
export type {
  LoadOptions,
  Plan,
  PlanCastMember,
  PlanExhibit,
  PlanFile,
  PlanNote,
  PlanPanel,
  PlanResult,
  PlanRoom,
  PlanText,
  Where,
} from './types.ts';
