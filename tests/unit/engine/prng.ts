export { between, prng } from '../../helpers/prng'
