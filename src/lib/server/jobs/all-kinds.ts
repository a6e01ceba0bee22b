// Every job kind, registered by importing its module, and the runner that serves them. Processes
// start jobs through this file (the server hook, the worker process), so a new kind only has to
// be added here to be run everywhere.
import './design-queue';

export { startJobRunner, startJobRunnerAtBoot, stopJobRunner } from './runner';
