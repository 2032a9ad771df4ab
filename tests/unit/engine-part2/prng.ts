export { mulberry32 } from '../../helpers/prng'
