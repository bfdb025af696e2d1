// What the rest of the app may use from the admin feature.
export { PeopleTable } from './components/people-table';
export { CreatePersonForm } from './components/create-person-form';
export { ProjectAccess, type ProjectChoice } from './components/project-access';
