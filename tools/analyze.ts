import { analyzeWeb } from '@seinework/network-analysis';
import { readJsonFile, runCommand } from './cli';

// npm run --silent analyze -- WEB.json  (METHODS.md §11)
await runCommand('analyze', () => analyzeWeb(readJsonFile(process.argv[2], 'web')));
