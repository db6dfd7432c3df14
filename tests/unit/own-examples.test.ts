/**
 * Headroom's examples, seeds and tests are a scenario of its own (issue #19): vehicles and
 * engines are described generically ("one-ton crew cab 4x4", "6.7 L inline-six, common rail")
 * or given invented names, and businesses are invented too. This test fails when any text file
 * of the repository (lockfiles, node_modules, .git and build output aside) names a real pickup
 * make, model or trim, an engine maker or engine family, a transmission maker or model code, or
 * a maker of the injection, turbo, dyno, tuning, parts and tools a build would otherwise name.
 *
 * The list is kept as SHA-256 hashes of whole lower-cased names, so this file names none of
 * them. A name is a word ("xyz"), a hyphenated word as written ("x-250"), or two words in a
 * row ("two words"); camelCase identifiers are read as words. To add one, hash it the same way:
 *   node -e "console.log(require('crypto').createHash('sha256').update('name').digest('hex'))"
 * Leave out words that are also ordinary English or trade words (edge, banks, ranger, canyon,
 * titan, tremor, limited, platinum, international): they would fail honest text.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');

// prettier-ignore
const realNames = new Set([
  // Pickup and truck makes, and their parent companies (30)
  '09b7b4bebb61f3282b34b1cffff852224f4ad30bb38f97d1d187da953a2e5a5e',
  '1573a511a45a3b45d3ab96319ed59e786458dc572f370c2102105881ae3dcb70',
  '1d45adac4616bb214f4788af0a64779a1d0ee43a58a16c5dd5b328c09c70f353',
  '337b8d2c1e132acd75171f1acf0e73b20bc9541720d5003813f59ef0ad51f86f',
  '341fe1ad8fd978775e06a519d053bcbad8b6b3d1d83de9a5bebe7b94f679122d',
  '40fc6718a81fe76c5fb536e0c63d7dd95fc2f7f8a282cd1dbcd44c5b36c9d15a',
  '44e8dd36c54ce8a436e35ca82398e2f5d93f951c2e4eee39348c1fc8a56b7267',
  '4747e8f2fae7efb933ade3a7f21a208f9b47996bb7e503cfca828bf927fb8566',
  '4d13e1dbe7ab3f90f7cf9f49beb4fa7abc5624967d6db79b9e61c022c065d083',
  '5b75539f8576e7257617c81cc1c888fb90fae9526cc9caefdeb5a1adedac18a3',
  '6d7cd394799273e8d78192e700baf0329cd9e16df91044e3f1a36fdeed80af31',
  '7358bd4ec877e1b622397ab4f9706b76680348a2886bfc0a675ed0555085d0ea',
  '784109ed21a6f7c669eaa3d404cb2cd6ce91f3334b836bc7021b0fee26af26ed',
  '7c5a8d1a22d6a699b4a0953448b44afe451b8f71849c4cf09d5d50fe5bd89281',
  '8417659f46b5b43b2bb9396f794ab19728546f699babdb914d97bc5adcb9f528',
  '8652f6cd9088f1fa0566de0bb4916a3991c4be6fe27dc4197562a7bf0cd42e0e',
  '96e3955426b1ce0cb6525d9183964dffb90b39d2c95e11882abc388b6eb42cda',
  '9a046660abc6d16a4fb3e837e8b24faf9a454adcfe480a0e8119e9e0a49b457b',
  '9e48bad6e31c128258257bd997eacca666f0dae2049027b545ea48a0cf43ed71',
  'a0a1ee53327a50930a5474325b570e84d82b68638fe454102b627388775e48d1',
  'a57526b5d973ebadf6cef300981e26ff697024b15a85172c3d5883041ab54b03',
  'a631f4488a457da27b4a64dc8f2d85085b50ff568be99125cf6f8f45c759878e',
  'aa59343f9ebb354fb5cdff10eae7fa725a0b1e2ef6b8ea360d95873fa28df8a9',
  'ac85892205b92e8cecdc87185a3fbf039f04b2a7751ccf0e8a1f547d53b9945a',
  'b2808c947ea04c193e096f4923d13599ab96317dee1e33c8705bfc863f354903',
  'b942714f0ecb8e42f27b6baefd673c5dcb1676928ed0482a6d84b7a6b44e3dc4',
  'b94a3c16218a029b3ca2b3621c5362cc538d0b751003e3240850f955303d3cb6',
  'c7ad2ac22b4500bd63f64e6809fa98fbd6fe130806c5d590887c12d30d05419e',
  'd254fa846ea7252ec95bf229075e9ac6bda6f8944f5e445e589a4d54184c931d',
  'f081f7b8d4310e67a7572f60b6070a3034d5f1ae1465b3fe4f8dafca9213a0e3',
  // Truck makers that build chassis and engines (4)
  '9ea7571156bae20b253e4d966f02002127eb3f13eb55594f3df80f716ee071bc',
  'ae3f55960ae168af6541b18b6040e89e029c126bfdbec4884f61faeb55587ca2',
  'bccae4ce7be65100a8472740c829b76610a653a6816a7b88c7f7def8ae8e9b0c',
  'bce6e56d30ad9fe09977ce1eabf36a35fe83fb8eda7bfbc3971fc5afd73b1984',
  // Diesel engine makers and brands (20)
  '014e3f1f20764cc5dac7ce673852e314fba41cfe7b3d15ee929946ee4ad8ad1f',
  '2808e5da71c68277cc671dff4f2efe4e7ddc8046d5ce971bbcd670af63901852',
  '3bc175e9ce56d1fc2d86ab6ea2ec56eb21930540b56a5b6e3840dfb64287acab',
  '3e2235c17179536af12971f7be6a56d9d9ee62e14cced8591a2bba64ef5ba588',
  '49762afb5c3e8e4b6762519bcf03b6fa9ac9b593ec36b1dfb5fbad3925e647cd',
  '7796aa4d9a78cd98e2d5253ed7e110480be7cd91ccf21d8ee3dfc4c633c4d207',
  '81743d354c2c82de4ac0d99286fcd2aabd00dc293c0d9cab3bdde6d892f2b6bb',
  '83a4dc213d64c7f2d15e8910597615f3f0ce6540d5a3c5423e1967bdea44c832',
  '8b51ddcabcfe393ba22c5d3f9d3ee78faa83fbfe9e6b63faeacbeb298fbd5a2c',
  '917ebb3396b2ff2e27b75e3fe421b1edc07b998f74350472f3abc5c6620a68db',
  'a08df685fbbf71e14189e83f21e5ba731b4cd6c06572f475347449c52bcbf75f',
  'aa7d397c4ccf6faa637278ab96f87d2789f7e45395f48bb5ba1f4d4514bb51e8',
  'b5b237b8b6cc617e402b4c7bff24a4f187d269c4c493226e070f204c1dc64f51',
  'baffdf37aa5d3961c77ba6315dcd836823a20ead97869d4232780df8e4369f13',
  'e3a2d8fabafab41a51e06b1ffccf5061bbbb66cd785c938cac9266dc55b9687a',
  'e58c9634bf3a383fc169561665cbcadf24468a90d13c334db98f8213d738edaa',
  'e7eceae55aeba313c03e84939fd29301370b221aa2fe9b1fe8f43bb521ab6393',
  'eaac0f48d2ccec4d9cfca2115cb16800ecd23f60265f0ca0995ef41b8c55ac60',
  'efde533abdbc2e99e1e46ef410d29418782545e3c7fbae2c8c0d2286a9805ab8',
  'f36e9f2d32d713d8c07d728471c99e3902fa1900862b4923d47ab15679735464',
  // Engine families (codes and names) (24)
  '15fcbca373ac4001f6fd95867a8a1997e09c261b43b56b4333d418a2c28ce221',
  '178f350607c39dd1731bac6eb8d95bccac171562e8ce47feffd10ddaeb3f9c44',
  '196b8bc52871c931d82daedd8fd5ce633b6a77b93c78d4b8f5f81b401a622da0',
  '1a80fc9ce193baecb8a4d390fd6f2bcc1ed0bac154a4306adfc7b68c5faad6bd',
  '1e982acfb18b00eb4219caa7a271c788df5a781b51eab2b174d38b3837df96a6',
  '24c2a1b647d7d115570f67fa9b5db335c90720b036b71948e70346b366f485cf',
  '33c6ded4c534e2c0c693e72efe60b087b3e192ee98620adbc3d6208f7d5c9b5a',
  '3e9b432fb445a1cb3526b675b20a61c2ac533a139936caeec70ccdb573db1788',
  '50859da331a842a8dd2d40003d62b1364dc9669719c1def6ecebeb9bf88a306c',
  '55a2d9e05c506177ac658f3870e8c4f79bf636cedd07e0fdeacf274256a30a5f',
  '579565eb5522519f1aa70f1e16841c33757ff8a1ede3622442be1dd7c3013fa4',
  '585ef9e60d63f8bc44f7f001c87510f282faa0fbb13b7844ecc9015fc8feb425',
  '5d4321314e60ba31af9017409c774abe5b3ac742a142e15ca503c5bb399da339',
  '6a6a723e12c799f0692433d42e763c63e409b0387ed72450f68413cf2a1f2375',
  '7cd5ffb708055e7484a139469a0c2ac6f929c930a7b09906dd5c874b3cdada99',
  '8732b02bd9fa0d40b2a4149d543eee9ceb5b0634050f6313b8a5b953dcdc54c9',
  '8b8ee043e2401e844bb5337b0dc8763512a1b3431be07772c129f36f09d2aae9',
  '938dec4f12caf9d2e8b6c150c9f9634cae95616444b848b42ba4895df7343d70',
  'bd0025031d4a40ca7316715da312db483116de9ad150e22b438734abe4a0ee22',
  'c35ea3d1ccc2cbc291bd2bb63a67e4b3ddd4f0decee69d54c812d05935a3026d',
  'c3bb14dd8269eced3955227952df9ab886f8937e622ddb8a152b5ccd56349718',
  'd5747fa890da9cbdddd89af63e31690250c950587c1ce494c6b87090c400b7eb',
  'e688a6e9350613beb2081f2a9ffe01ce361d3590095ffd02aecd79f172a18957',
  'fe84d6f30a53002931570b2a209999e776d0cb183fcec03042d9a2079eb3391e',
  // Transmission makers and model codes (20)
  '058b3a6f5410d1d2863456e06934c8d7358144bb9e3b7d745927b48ac6f040e3',
  '0b028f032e9fe1382354b4951663672e4b2fc3067ee3acc912484dbab28897ea',
  '0de42923f35e89bfdd6dcb4f0b82639920ebd2be594ec4dce78859a655d53661',
  '160811dfd4d7280a1050e40087290ec69e7f7b83628f46911e29202ae581a276',
  '2695989c0bc208ddef111f4e2344477627f3d9a599e5268ac816e8791dff93be',
  '3b94b8250989ef8846f378638a8b14027feadde196715f924fbe171f4adc1037',
  '407b390052b5e659a8501ecb9e7be656c3a865bb023c6a01c5ec3e0877495d9e',
  '41b133012fe45470a155abc927756d790ff162a0f82a470e3af6f6c26b848b74',
  '422ffd6c7b2d0cc6522b1058d1c3d1a573c013bb30e03532c3a0309b6f039e38',
  '527700c346738791eff0ed986282072bb6a631a66527b8b8c742342b7c685613',
  '54b5bda2420952a482068bc1ff512f3f28ffa84c2f22e79e75d7c89bfdeed28b',
  '6ae95ca5f8098007fc09f75761e85d4d1f6c9dc16e3f1679de4196127b0387b7',
  '71a1f6658e99e9a1d553ba930211d23e1135072816efec7f913c7e8a2c85cebc',
  '78ba7173cddea5a9171b7ea083986a3c508fc90199ac0d2f6e0a030b2e3337dd',
  '85474078c6974329fb5e8e1aaa86aa343cee07d880c062719a8bafe81b318dff',
  'abe14626784645ec017083020bf68aade6623bca60887cd4aff336e2059d1d71',
  'bc367ce53e6b3eca5d77e49952b563c8b8dd7d158d5f9aa83d3c7f1590380e15',
  'c5b14b6da5f92d66d09ce0d4eec89aca4221b245c3f81dc4d6021a9068009d70',
  'd5a2d79b8588fc0b9328f735673b7bbe4d2595095cc93bea28b590210d824a62',
  'e6b3b9895a2e9810ddbd843c744d4cfaada482261520004b6b19f4f1309a4f3f',
  // Injection and turbocharger makers (7)
  '0600c79833cc723f51a26a1c39b46fcc6bb909a6db9b8c9a3885469f8aaa3fc2',
  '78fe4a402ea19b4d5f0415bde1cc2e4743874eb8607363174763d0353cb8d278',
  'c0d0472ae864dfd5686dae2ea340e676c9a245aca47ad6dacac348d4a25a4e32',
  'cb9fa2a3b15a4d2e76d27bf339ea5f0d34623b527be80a03186b23ea42a814bf',
  'd6a705c7dbae5e13364ffd5056e7bb5b7fc06ff1ba73a1a4cbb90fd39be710fc',
  'd8710cb5d8462862cef18a37424c82ec5fbe971c2d91c4ab2e657d2566cbb413',
  'ee878cd79c98015bad75a8eb61af042b7a66dfb7d23d119d6bad7262ecaeb704',
  // Pickup models (20)
  '03f5540bccd642e6568e7c9faee84b3d9d79f3bddea4b4852e7bc7413584ffb3',
  '20d1a141586e97cc978f49bfe8e727102cfec100fe78e1daed55b91dadf42e98',
  '23d3c83b4991b2a02472672b7a9b7d685771275bb5e7bf25a587913a5ea0a20f',
  '248f9a8dd8f1153fc45e4c5240622928a0b20be7d22d6ab4b9094919721d9c6a',
  '3d3d2d01bc9f4a95b273f9eed579bba0dcf8edc1f18874706b73cdce572a9a64',
  '3ee8052ab26ccee12b9834488967c7885f99e211deacb8dfe9fe3c5afa653d9c',
  '49f5a1142ecb98376f8785778f32b6c5532add36032e994de04e961baee8e34a',
  '53008a4021d501893a3fc103c1dd05c23342327d230db16793a6302775dd07b1',
  '6526906f045aaab2e1433aab1a05e0c57422d4f0013afc2667717840608650e9',
  '71e694e6501152f38225ebe470403162423d0434f652379a36205466e2dbb4bd',
  '740a67a7fdc32b85218ef7a3d9ca39c63a41ea2e3498c15caeb43711ca674df7',
  '8186b5ab9c2a47fea3e38588e9c8fa100f6b257711585523a3e17ddd5891b0a3',
  '8a45ff8510cba47f55187160b6e3efecfc9f336569438d56e11e6496291a1bfd',
  'a92f6bdb75789bccc118adfcf704029aa58063c604bab4fcdd9cd126ef9b69af',
  'cc49c3897290a505cec002cebd1506f308105d42c96bbea370e54f02c020b54d',
  'd43b363f6f4bb7a61104e957c7f1a00f97b9dcc9ccafcaea13aa454b2a86937d',
  'deaea0dc2cd97147babce19559100372a0c1316ff52cc9a4065ec4962b9fde71',
  'e4a8280239be4fec873dddc6cc0466729efde2505b1ed1a16b2dc29348260de9',
  'ef35ee2fbf0b1463273afbfd3c0041d989b1d00eb19a4c30a0a296f0109535a3',
  'fdd703d1a7cdcb4057d858bc45b8110d03786ee1f9f4dad5038400c9f1cc9b67',
  // Trim names that are brands (16)
  '0d4b06bd4656ca89f62df5ee94662f806cbcd20376bb8de0fa1d402536560b85',
  '1cf1a7f24ea659b13f42e1ba50b23606637767cea45fb60276184de7c4b07aab',
  '33f78340ca9ef1ed28ea0e34db93ccefbdd5a954c799febc026a1438d668c66d',
  '37bfdcb4c50793a6286fa0efe07b9e6bba8605b2c32e329fb9f71f225545f027',
  '3843b46c0cb634d4a3693c35de26e73b80e009bf0679168c59a7cf55474e7432',
  '5789fbe14720be0c2eda2f30e5a3271f6538e0c4f9baced82e236fe4f027b4d3',
  '7a965f7b039fc1f0666868269668595accc840d9da92f2a6c46adcb7a470da1e',
  '7ac06046fda28dbed25b7b346b27f45b2a15184c5e8e57a6aacc159399d8b80e',
  '94fff346cc28cb554d166914ee951541509bb626acb91d166785a5d479857771',
  '9a13a9d1ca9254fbb69dc93472295b15d741742de15dfde64d4a2320e1e29200',
  'b01c69fcde0e1fc95e40842b47c6ab7be4c85af61cb28386fee4b9dde0e43a8b',
  'c361b2a9f8046ee44c2fbd09d71cc95130fd241b0fcec3dfeb10579f50c12f95',
  'c587def9bdafb3209e28da9d90f1f05b0456c7a23b17da16087696ad059ef341',
  'ca51c21b185231b16e86939818e5641ed7ace538c16025c70d2551914aa1fa20',
  'cee515720c19b3ad855d35ab72eddd9107bde3496c8d9b0603293edc8b66d11b',
  'e1ccf5aa4264ec4f27f108f0a63f8f23f80347f4fad4b0910d68805674e638dc',
  // Dyno, flow-bench, tuning, parts and tool makers (23)
  '00bb39b4f5c7dd52f96668471d2194e672e19d1026fdd4621522e7320ca95d27',
  '118e22132f6f28f2853561a14753367b6e900911e9f888e54e95cb33feb9468b',
  '321b9dd28e0effdc97cf4b8bb5694006a14a74f25c33fe6126eeef7f1fe03278',
  '380e01e95f4e0128a672b963ed721300e907685ed67779370214cad20fcf1576',
  '49ab10f3365432fac2d51efb89efa8c9fde05c8664acc48373283a8f6d5c19a6',
  '6024f0bdbec7ae4ca8f0d052d40c23988cfb3dca128057a527f364226bf30c03',
  '7bbd0d9e52dbae990480259b74e6a43773b6c12cba30f8b169eb2da3b9125ba1',
  '8df97fe76d5df3333abebe0d3cc347085d09ef33d133b2c40f08d3d07a7f155b',
  'af29296395cc3fd0c74348d8038efcc0c7b1a3e006bf8eaa72d7be79c697dae3',
  'ca27a697d88ac95f0cb5bc4d5c1ff50911f36d07287ed1b00719b9602b4b4a41',
  'cf835fc094349f22c2214fc8256cb895fcbcc01c77083c0f94114703d9e79a29',
  'd00ebc09922781e080c6d78a5da69f3a998a84974fc8aeb05441dcca74abf018',
  'd294a1a84b7b432fe5098f3f995b76b5f63c7c659de9af5a121060196057024c',
  'd46ee5ebedc5067bf06769e1de9e1d98db657ac25c0c9a4dc8a2cafab9f11231',
  'd5c16d5f970c84f6e28cdd2ddda97d802d6c077bf17a02dd4c335675291fad78',
  'd8b502c50edab03733438e0f23aadcfaa5b42b7b0830c14669d5ceb986a7fd90',
  'dd9cac6c3704500d9f5430b943b893bfe322696ef9614cbd124117c89fbcf3eb',
  'e3fd6f4eee35def571fd7ed305537f51ad03d4e48000143b0df54ce3be6a2f0b',
  'e922a2a27ad3c3ae4a96c8ef4fa9bef590129a82fb28a9597397ea8fa8e0c232',
  'ecb648ddcc042480f8494a7be9755a70ec601937a967124751fa03c991dfe8df',
  'eed59efb8160b5cf0694be9ab5cefdec52adeb5c1af98823f38b0a90a9743e91',
  'f754b23a7d68eaf9fc311eb71c00f28a71880fad2bef721367e65ce6dd337fb9',
  'fb65381840722bb1bd7a7da2420eece78ed9e1be8779a1798e5cdc2070fb780e',
]);

/** Folders that are not the repository's own text: dependencies, git, build and test output. */
const skippedFolders = new Set([
  'node_modules',
  '.git',
  'dist',
  '.data',
  'test-results',
  'playwright-report',
  'coverage',
]);
const lockfiles = new Set([
  'package-lock.json',
  'npm-shrinkwrap.json',
  'yarn.lock',
  'pnpm-lock.yaml',
]);

/** Every file under `dir`, relative to the root; symbolic links (a shared node_modules) are not followed. */
function filesUnder(dir: string): string[] {
  const out: string[] = [];
  for (const entry of fs.readdirSync(path.join(root, dir), { withFileTypes: true })) {
    const rel = path.join(dir, entry.name);
    if (entry.isDirectory() && !skippedFolders.has(entry.name)) out.push(...filesUnder(rel));
    else if (entry.isFile() && !lockfiles.has(entry.name)) out.push(rel);
  }
  return out;
}

/** The file as text, or null for a binary file (a NUL byte in its first 8 kB). */
function textOf(file: string): string | null {
  const bytes = fs.readFileSync(path.join(root, file));
  return bytes.subarray(0, 8192).includes(0) ? null : bytes.toString('utf8');
}

/**
 * The candidate names of one line, lower-cased: each word, each hyphenated word as written,
 * and each pair of neighbouring words. "longHaulX-900 cab" gives long, haul, x, 900, cab,
 * x-900, "long haul", "haul x", "x 900", "900 cab".
 */
export function candidateNames(line: string): string[] {
  const spaced = line.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
  const out: string[] = [];
  let previous: string | undefined;
  for (const compound of spaced.match(/[a-z0-9]+(?:-[a-z0-9]+)*/g) ?? []) {
    if (compound.includes('-')) out.push(compound);
    for (const word of compound.split('-')) {
      out.push(word);
      if (previous !== undefined) out.push(`${previous} ${word}`);
      previous = word;
    }
  }
  return out;
}

const hashes = new Map<string, string>();
function sha256(text: string): string {
  let hash = hashes.get(text);
  if (hash === undefined) {
    hash = createHash('sha256').update(text).digest('hex');
    hashes.set(text, hash);
  }
  return hash;
}

/** "file:line: name" for every real name in the repository's text. */
function realNamesIn(files: string[]): string[] {
  const found: string[] = [];
  for (const file of files) {
    const text = textOf(file);
    if (text === null) continue;
    text.split('\n').forEach((line, i) => {
      for (const name of candidateNames(line)) {
        if (realNames.has(sha256(name))) found.push(`${file}:${i + 1}: “${name}”`);
      }
    });
  }
  return found;
}

describe('examples are our own', () => {
  it('keeps the list as SHA-256 hashes only', () => {
    expect(realNames.size).toBeGreaterThan(100);
    for (const hash of realNames) expect(hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it('reads words, hyphenated words and word pairs, whatever the case', () => {
    expect(candidateNames('longHaulX-900 cab').sort()).toEqual(
      [
        'long',
        'haul',
        'x',
        '900',
        'cab',
        'x-900',
        'long haul',
        'haul x',
        'x 900',
        '900 cab',
      ].sort(),
    );
    expect(candidateNames('A One-Ton Crew Cab')).toContain('one-ton');
  });

  it('finds no real make, model, engine or maker named in the repository', () => {
    const files = filesUnder('.');
    expect(files).toContain(path.join('tests', 'unit', 'own-examples.test.ts'));
    expect(files.length).toBeGreaterThan(100);
    expect(realNamesIn(files), 'real names: describe the thing or invent a name').toEqual([]);
  });
});
