import { verifyOneIssuance } from './verification';
console.log(verifyOneIssuance.name, await verifyOneIssuance.measure());
