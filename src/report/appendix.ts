/**
 * The appendix: the method (a template fragment), the assumptions and defaults of every
 * stage, and the inputs that identify this report (note SHA-256, tool version, archetypes).
 */
import type {Root, RootContent} from 'mdast'
import {ARCHETYPE_DISCLAIMER} from '../engine/archetypes.js'
import type {StageEvaluation} from '../evaluate/index.js'
import {bulletList, code, heading, paragraph, table} from './mdast.js'
import type {ChainEvaluation} from '../evaluate/chains.js'
import {ADC_ARCHETYPE_DISCLAIMER} from '../engine/chain/archetypes.js'

/** The method of DESIGN §8.5–§8.6, printed when the note has chains. */
const CHAIN_METHOD: string[] = [
  'Stages in series are cascaded as ideal sources: each stage’s closed-loop output impedance is taken as negligible against the next input, and each later stage takes the previous stage’s output range (ideal op-amp, nominal parts) as its input.',
  'DC: the worst-case error at the converter input is Σk ek·Πj>k|Gj|, every contributor of every stage kept under its key and carried through the later gains, plus the converter’s offset, offset drift·ΔT, gain error·max|V|, gain drift·ΔT·max|V| and INL·LSB; RSS over the same terms. Input-referred = total ÷ |ΠGk|; in LSB = total ÷ LSB, LSB = span/2^bits (standard converter texts). A chain calibration removes what the stage calibration table removes, and the converter’s offset (and gain error with offset-and-gain).',
  'Noise: Sout(f) = Σk Sk(f)·Πj>k|Hj(f)|², Sk the full output density of stage k from its own netlist and sources and Hj the solved signal transfer of stage j (for an instrumentation stage, the densities and H = G/(1 + jf/(gbw/G)) of its block model), integrated over the chain’s band with the same adaptive rule as a stage. At the converter σ = √(σchain² + noise² + LSB²/12), LSB/√12 being the quantisation noise of a busy input (standard converter texts). Noise-free bits log2(span/(6.6σ)) and effective resolution log2(span/σ) (common practice), both capped at the converter’s bits.',
  'Alias rejection = −20·lg(max over fs − fH … fs + fH of |H(f)/H(0)|), H the product of the stages’ transfers; when the chain’s −3 dB bandwidth exceeds fs/2 the noise integrated to 10× that bandwidth is given as well, since it folds into the band.'
]

export interface AppendixInput {
  evaluations: StageEvaluation[]
  /** Evaluated chains (optional). */
  chains?: ChainEvaluation[]
  /** The method fragment (templates/…/method.md, or method-short.md with its sources), parsed. */
  method: Root
  /** The template's `appendix` option: `short` prints one page of method, without the chain method (default `full`). */
  form?: 'full' | 'short'
  sourceSha256: string
  toolVersion: string
  /** The note's file name as given. */
  fileName: string
}

export function buildAppendix(a: AppendixInput): Root {
  const chains = a.chains ?? []
  const short = a.form === 'short'
  const children: RootContent[] = [heading(1, short ? 'Appendix A — Method in brief' : 'Appendix A — Method'), ...a.method.children]
  if (chains.length > 0 && !short) children.push(heading(2, 'Measurement chains'), ...CHAIN_METHOD.map((t) => paragraph(t)))
  children.push(heading(1, 'Appendix B — Assumptions and defaults'))
  if (a.evaluations.length === 0) children.push(paragraph('The note has no stage blocks.'))
  for (const ev of a.evaluations) {
    children.push(heading(2, `Stage ${ev.input.id}`))
    const items = ev.block.defaulted.map((d) => [code(d.key), ` = ${d.value} (not given in the note)`])
    if (ev.input.opamp.archetype) items.push([`Op-amp ${ev.input.opamp.name} is an archetype: ${ARCHETYPE_DISCLAIMER}`])
    if (ev.result.bias.overTemperatureMissing) {
      items.push(['No over-temperature bias current was entered (ib-max): the 25 °C value was used across the range.'])
    }
    children.push(items.length > 0 ? bulletList(items) : paragraph('Every value was given in the note; no default applied.'))
  }
  for (const ev of chains) {
    children.push(heading(2, `Chain ${ev.input.id}`))
    const items = ev.block.defaulted.map((d) => [code(d.key), ` = ${d.value} (not given in the note)`])
    if (ev.input.adc?.archetype === true) items.push([`Converter ${ev.input.adc.name} is an archetype: ${ADC_ARCHETYPE_DISCLAIMER}`])
    items.push(['Stages cascaded as ideal sources (each output impedance negligible against the next input).'])
    children.push(bulletList(items))
  }
  const archetypes = [...new Set([
    ...a.evaluations.filter((e) => e.input.opamp.archetype).map((e) => e.input.opamp.name),
    ...chains.flatMap((c) => (c.input.adc?.archetype === true ? [c.input.adc.name] : []))
  ])]
  children.push(heading(1, 'Appendix C — Inputs'), table(['Item', 'Value'], [
    ['Note', [code(a.fileName)]],
    ['SHA-256 of the note', [code(a.sourceSha256)]],
    ['Tool', [code(`ampreview ${a.toolVersion}`)]],
    ['Stages evaluated', String(a.evaluations.length)],
    ...(chains.length > 0 ? [['Chains evaluated', String(chains.length)]] : []),
    ['Archetypes used', archetypes.length > 0 ? archetypes.join(', ') : 'none']
  ]))
  return {type: 'root', children}
}
