// What the rest of the app may use from the project-log feature (the project's log of uploads, changes, exports and mail).
export { ProjectLog } from './components/project-log';
