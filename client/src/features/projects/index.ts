// What the rest of the app may use from the projects feature.
export { ProjectList } from './components/project-list';
export { CreateProjectForm } from './components/create-project-form';
export { ProjectOverview } from './components/project-overview';
export { useProjects } from './api/use-projects';
export { useProject } from './api/use-project';
export { standardName } from './components/standard-name';
