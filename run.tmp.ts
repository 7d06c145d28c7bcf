import { main } from './src/cli/main.js';
process.exitCode = await main(['node','tankcheck','run','examples/demo.yaml','--engine','ngspice','--measured','examples/demo-measured.csv','--only','m*','--out','/tmp/demoout','--no-cache']);
