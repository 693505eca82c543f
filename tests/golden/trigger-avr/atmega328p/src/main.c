/* ATmega328P replacement timing stage, triggered one-shot
 * Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
 * Revision r1, engine 1.0.0; target 1 (atmega328p)
 * Input PD2 (INT0, pin 4), falling edge: EICRA ISC01:0 = 10
 * Output PB1 (pin 15): TIMER1 clock F_CPU/64, pulse on after
 * 1 counts (4.000000 us), off at 27501 counts (pulse 110.0000 ms)
 * Worst-case edge-to-output latency 37 cycles (2.312500 us): ATmega328P datasheet, Interrupt Response Time: 4 cycles to the vector + 3 for its jmp, + 2 to finish the busy loop's rjmp; INT0 handler (templates/atmega328p/trigger.c.hbs, naked) up to 17 cycles to the timer start (restart rule: cbi 2, push 2, ldi 1, sts x4 8, ldi 1, sts 2, ldi 1; ignore rule 5); the compare handler's entry to the pin change adds 11 (4 + jmp 3 + rjmp 2 + sbi 2), the same for the off edge, so it shifts the delay, not the pulse (AVR Instruction Set Manual cycle counts)
 * Handlers are naked and written in assembly so their cycle counts are fixed:
 * none of their instructions changes SREG, so SREG needs no saving.
 * Register values: ATmega328P datasheet, External Interrupts and Timer/Counter chapters.
 */
#include <avr/io.h>
#include <avr/interrupt.h>
#include <avr/power.h>
#include <stdint.h>
#include "timing.h"

#if F_CPU != 16000000UL
#error "F_CPU differs from the clock this plan was solved for"
#endif

/* Input edge: restart rule: take the pulse off, clear the count and pending
 * compares, then start the timer (17 cycles to the start). */
ISR(INT0_vect, ISR_NAKED)
{
  __asm__ volatile(
      "cbi %[port], %[bit]\n\t"
      "push r24\n\t"
      "ldi r24, 0\n\t"
      "sts %[ctrl], r24\n\t"
      "sts %[tcnt0], r24\n\t"
      "sts %[tcnt1], r24\n\t"
      "ldi r24, %[flags]\n\t"
      "sts %[tifr], r24\n\t"
      "ldi r24, %[cs]\n\t"
      "sts %[ctrl], r24\n\t"
      "pop r24\n\t"
      "reti\n\t"
      :
      : [port] "I"(_SFR_IO_ADDR(PORTB)), [bit] "I"(PORTB1),
        [ctrl] "n"(_SFR_MEM_ADDR(TCCR1B)), [cs] "M"(3),
        [tcnt0] "n"(_SFR_MEM_ADDR(TCNT1H)),
        [tcnt1] "n"(_SFR_MEM_ADDR(TCNT1L)),
        [tifr] "n"(_SFR_MEM_ADDR(TIFR1)), [flags] "M"((1 << OCF1A) | (1 << OCF1B)),
        [mask] "n"(_SFR_MEM_ADDR(EIMSK)));
}

/* Count 1: pulse on; the first instruction, so it has the same entry as the off edge. */
ISR(TIMER1_COMPA_vect, ISR_NAKED)
{
  __asm__ volatile("sbi %[port], %[bit]\n\t"
                   "reti\n\t"
                   :
                   : [port] "I"(_SFR_IO_ADDR(PORTB)), [bit] "I"(PORTB1));
}

/* Count 27501: pulse off, stop the timer, count back to 0, clear the
 * pending compare and INT0 flags, then unmask INT0 for the next edge. */
ISR(TIMER1_COMPB_vect, ISR_NAKED)
{
  __asm__ volatile(
      "cbi %[port], %[bit]\n\t"
      "push r24\n\t"
      "ldi r24, 0\n\t"
      "sts %[ctrl], r24\n\t"
      "sts %[tcnt0], r24\n\t"
      "sts %[tcnt1], r24\n\t"
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
        [ctrl] "n"(_SFR_MEM_ADDR(TCCR1B)),
        [tcnt0] "n"(_SFR_MEM_ADDR(TCNT1H)),
        [tcnt1] "n"(_SFR_MEM_ADDR(TCNT1L)),
        [tifr] "n"(_SFR_MEM_ADDR(TIFR1)), [flags] "M"((1 << OCF1A) | (1 << OCF1B)),
        [iflag] "n"(_SFR_MEM_ADDR(EIFR)), [intf] "M"(1 << INTF0),
        [mask] "n"(_SFR_MEM_ADDR(EIMSK)), [inte] "M"(1 << INT0));
}

int main(void)
{
  /* Full clock whatever CKDIV8 says: CLKPR, ATmega328P datasheet, System Clock Prescaler. */
  clock_prescale_set(clock_div_1);

  /* Output PB1, idle low. */
  DDRB |= (1 << DDB1);
  /* Input PD2 with the internal pull-up (open-collector detector or contact). */
  PORTD |= (1 << PORTD2);

  /* Timer stopped at count 0, normal counting, pins not driven by the timer. */
  TCCR1B = 0;
  TCCR1A = 0;
  OCR1A = 1u;
  OCR1B = 27501u;
  TIFR1 = (1 << OCF1A) | (1 << OCF1B);
  TIMSK1 = (1 << OCIE1A) | (1 << OCIE1B);

  /* EICRA ISC01:0 = 10 */
  EICRA = (1 << ISC01);
  EIFR = (1 << INTF0);
  EIMSK = (1 << INT0);

  sei();
  /* Busy loop (one rjmp, 2 cycles) rather than sleep: waking from sleep would add to the latency. */
  for (;;) {
  }
}
