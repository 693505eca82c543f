/* ATtiny85 replacement timing stage, triggered one-shot
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 2 (attiny85)
 * Input PB2 (INT0, pin 7), falling edge: MCUCR ISC01:0 = 10
 * Output PB1 (pin 6): TIMER1 clock F_CPU/4096, pulse on after
 * 20 counts (10.24000 ms), off at 235 counts (pulse 110.0800 ms)
 * Worst-case edge-to-output latency 35 cycles (4.375000 us): ATtiny85 datasheet, Interrupt Response Time: 4 cycles to the vector + 2 for its rjmp, + 2 to finish the busy loop's rjmp; INT0 handler (templates/attiny85/trigger.c.hbs, naked) up to 17 cycles to the timer start (restart rule; ignore rule 5); the compare handler's entry to the pin change adds 10 (4 + rjmp 2 + rjmp 2 + sbi 2), the same for the off edge, so it shifts the delay, not the pulse (AVR Instruction Set Manual cycle counts)
 * Handlers are naked and written in assembly so their cycle counts are fixed:
 * none of their instructions changes SREG, so SREG needs no saving.
 * Register values: ATtiny85 datasheet, External Interrupts and Timer/Counter chapters.
 */
#include <avr/io.h>
#include <avr/interrupt.h>
#include <avr/power.h>
#include <stdint.h>
#include "timing.h"

#if F_CPU != 8000000UL
#error "F_CPU differs from the clock this plan was solved for"
#endif

/* Input edge: start the timer (5 cycles to the
 * start), then mask INT0 until the pulse ends, so edges while it runs are ignored. */
ISR(INT0_vect, ISR_NAKED)
{
  __asm__ volatile(
      "push r24\n\t"
      "ldi r24, %[cs]\n\t"
      "sts %[ctrl], r24\n\t"
      "ldi r24, 0\n\t"
      "sts %[mask], r24\n\t"
      "pop r24\n\t"
      "reti\n\t"
      :
      : [port] "I"(_SFR_IO_ADDR(PORTB)), [bit] "I"(PORTB1),
        [ctrl] "n"(_SFR_MEM_ADDR(TCCR1)), [cs] "M"(13),
        [tcnt0] "n"(_SFR_MEM_ADDR(TCNT1)),
        [tifr] "n"(_SFR_MEM_ADDR(TIFR)), [flags] "M"((1 << OCF1A) | (1 << OCF1B)),
        [mask] "n"(_SFR_MEM_ADDR(GIMSK)));
}

/* Count 20: pulse on; the first instruction, so it has the same entry as the off edge. */
ISR(TIMER1_COMPA_vect, ISR_NAKED)
{
  __asm__ volatile("sbi %[port], %[bit]\n\t"
                   "reti\n\t"
                   :
                   : [port] "I"(_SFR_IO_ADDR(PORTB)), [bit] "I"(PORTB1));
}

/* Count 235: pulse off, stop the timer, count back to 0, clear the
 * pending compare and INT0 flags, then unmask INT0 for the next edge. */
ISR(TIMER1_COMPB_vect, ISR_NAKED)
{
  __asm__ volatile(
      "cbi %[port], %[bit]\n\t"
      "push r24\n\t"
      "ldi r24, 0\n\t"
      "sts %[ctrl], r24\n\t"
      "sts %[tcnt0], r24\n\t"
      "ldi r24, %[flags]\n\t"
      "sts %[tifr], r24\n\t"
      "ldi r24, %[intf]\n\t"
      "sts %[iflag], r24\n\t"
      "ldi r24, %[inte]\n\t"
      "sts %[mask], r24\n\t"
      "pop r24\n\t"
      "reti\n\t"
      :
      : [port] "I"(_SFR_IO_ADDR(PORTB)), [bit] "I"(PORTB1),
        [ctrl] "n"(_SFR_MEM_ADDR(TCCR1)),
        [tcnt0] "n"(_SFR_MEM_ADDR(TCNT1)),
        [tifr] "n"(_SFR_MEM_ADDR(TIFR)), [flags] "M"((1 << OCF1A) | (1 << OCF1B)),
        [iflag] "n"(_SFR_MEM_ADDR(GIFR)), [intf] "M"(1 << INTF0),
        [mask] "n"(_SFR_MEM_ADDR(GIMSK)), [inte] "M"(1 << INT0));
}

int main(void)
{
  /* Full clock whatever CKDIV8 says: CLKPR, ATtiny85 datasheet, System Clock Prescaler. */
  clock_prescale_set(clock_div_1);

  /* Output PB1, idle low. */
  DDRB |= (1 << DDB1);
  /* Input PB2 with the internal pull-up (open-collector detector or contact). */
  PORTB |= (1 << PORTB2);

  /* Timer stopped at count 0, normal counting, pins not driven by the timer. */
  TCCR1 = 0;
  GTCCR = 0;
  OCR1A = 20u;
  OCR1B = 235u;
  TIFR = (1 << OCF1A) | (1 << OCF1B);
  TIMSK = (1 << OCIE1A) | (1 << OCIE1B);

  /* MCUCR ISC01:0 = 10 */
  MCUCR = (1 << ISC01);
  GIFR = (1 << INTF0);
  GIMSK = (1 << INT0);

  sei();
  /* Busy loop (one rjmp, 2 cycles) rather than sleep: waking from sleep would add to the latency. */
  for (;;) {
  }
}
