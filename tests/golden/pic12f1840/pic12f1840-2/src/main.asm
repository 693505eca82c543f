; PIC12F1840 replacement timing stage: the image source (gpasm, gputils)
; Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
; Revision r3, engine 1.0.0; target 2 (pic12f1840-2)
; TIMER2, mode isr, clock 16.00000 MHz, output RA2 (GPIO, pin 5)
; Period 1.000000 s (+0.000 ppm), high 250.0000 ms (+0.000 ppm)
; Register values: PIC12(L)F1840 datasheet (DS40001441), oscillator, Timer2 and
; CCP chapters. The same start-up steps, in the same order, are in src/main.c.

    list    p=12f1840
    radix   dec
    #include <p12f1840.inc>
    errorlevel -302                 ; every access below is preceded by BANKSEL

; Configuration words (datasheet Register 4-1 CONFIG1, 4-2 CONFIG2).
; HS: 16 MHz crystal on OSC1/OSC2. Watchdog off (nothing here services it), power-up timer on,
; MCLR as reset (10 kOhm pull-up on pin 4), brown-out reset on at the high trip
; point, fail-safe clock monitor off (a failed clock stops the output rather
; than running it at the wrong rate), high-voltage programming only.
    __CONFIG _CONFIG1, _FOSC_HS & _WDTE_OFF & _PWRTE_ON & _MCLRE_ON & _CP_OFF & _CPD_OFF & _BOREN_ON & _CLKOUTEN_OFF & _IESO_OFF & _FCMEN_OFF
    __CONFIG _CONFIG2, _WRT_OFF & _PLLEN_OFF & _STVREN_ON & _BORV_HI & _LVP_OFF

; Common RAM (0x70-0x7F) is reachable from every bank.
    cblock  0x70
        tick0, tick1, tick2, tick3  ; interrupt count within the period, little endian
        level_next                  ; LATA bit pattern for the next interval
    endc

    org     0x0000
    goto    start

    org     0x0004
; Timer2 interrupt every (PR2+1)*prescale instruction cycles. The level computed
; for the interval is written first, in the same number of cycles whatever it
; is, so both edges see the same entry latency. W, STATUS, BSR, FSR and PCLATH
; are saved and restored by the core (automatic context saving).
isr:
    banksel PIR1
    btfss   PIR1, TMR2IF
    retfie
    banksel LATA
    movf    LATA, W
    andlw   0xFF ^ 0x04
    iorwf   level_next, W
    movwf   LATA
    banksel PIR1
    bcf     PIR1, TMR2IF
    ; tick = tick + 1
    movlw   1
    addwf   tick0, F
    movlw   0
    addwfc  tick1, F
    addwfc  tick2, F
    addwfc  tick3, F
    ; tick == software divider (500)? start the period again
    movf    tick0, W
    xorlw   0xF4
    btfss   STATUS, Z
    goto    isr_level
    movf    tick1, W
    xorlw   0x01
    btfss   STATUS, Z
    goto    isr_level
    movf    tick2, W
    xorlw   0x00
    btfss   STATUS, Z
    goto    isr_level
    movf    tick3, W
    xorlw   0x00
    btfss   STATUS, Z
    goto    isr_level
    clrf    tick0
    clrf    tick1
    clrf    tick2
    clrf    tick3
isr_level:
    ; level_next = (tick < 125) ? pin bit : 0; C = 1 after the subtraction means tick >= high
    movlw   0x7D
    subwf   tick0, W
    movlw   0x00
    subwfb  tick1, W
    movlw   0x00
    subwfb  tick2, W
    movlw   0x00
    subwfb  tick3, W
    movlw   0x04
    btfsc   STATUS, C
    movlw   0x00
    movwf   level_next
    retfie

start:
    clrf    tick0
    clrf    tick1
    clrf    tick2
    clrf    tick3
    movlw   0x04
    movwf   level_next
    ; all of PORTA digital
    banksel ANSELA
    movlw   0x00
    movwf   ANSELA
    ; output latch low before the driver is on
    banksel LATA
    movlw   0x00
    movwf   LATA
    ; RA2 output (GPIO), the rest inputs
    banksel TRISA
    movlw   0x3B
    movwf   TRISA
    ; PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale
    banksel PR2
    movlw   124
    movwf   PR2
    ; PWM setup 5: clear TMR2IF before Timer2 starts
    banksel PIR1
    bcf     PIR1, TMR2IF
    ; TMR2ON = 1, T2CKPS = 3 (prescale 1:64), postscale 1:1
    banksel T2CON
    movlw   0x07
    movwf   T2CON
    ; TMR2IE = 1
    banksel PIE1
    movlw   0x02
    movwf   PIE1
    ; GIE = 1, PEIE = 1
    banksel INTCON
    movlw   0xC0
    movwf   INTCON

idle:
    goto    idle

    end
