#!/usr/bin/python3
"""Instruction-level run of an STM32G031 firmware ELF (Cortex-M0+, Thumb) in
python3-unicorn, with memory-mapped peripheral hooks that log every access.

Our own test harness. It models only what the timing proof needs:
- RCC (RM0444 reference manual, RCC chapter): a ready flag comes only when its
  oscillator was switched on and can run on the chosen package. HSIRDY follows
  HSION; HSERDY comes only with HSEBYP set and an external clock fed in, or,
  without HSEBYP (a crystal), only on a package that has an OSC_OUT pin, which
  the TSSOP-20 has not (DS12992 pinout). PLLRDY comes only for a legal
  RCC_PLLCFGR (VCO input 2.66-16 MHz, VCO 64-344 MHz (from memory), PLLR >= 2)
  from a ready source. SWS follows SW only when the selected source runs.
- FLASH_ACR LATENCY against SYSCLK (RM0444 FLASH chapter: 0 wait states to
  24 MHz, 1 to 48 MHz, 2 to 64 MHz).
- Peripheral clocks: a GPIO or timer access while its RCC_IOPENR /
  RCC_APBENR1 bit is clear is recorded as a fault and the write is dropped,
  as the unclocked block would drop it.
- Timers: registers only (no counting): EGR.UG sets SR.UIF, SR is rc_w0.
- GPIO: BSRR/BRR update ODR.
- NVIC ISER is write-1-to-set.
The run starts from the reset vector (SP and PC from the vector table at
0x08000000, the boot address from main flash) and stops at the first WFI or
branch-to-self, or when the instruction budget is used up (then it names the
register the code kept polling). For interrupt plans the caller may ask for N
handler calls: each sets SR.UIF as the update event would and calls the
handler found in the vector table, as the NVIC would, recording the pin.

Triggered plans: `edges` (a list of "rising" / "falling") raise EXTI line
`extiLine` as the EXTI would (RM0444 EXTI chapter): the edge sets RPR1 or
FPR1 only when that line's RTSR1 or FTSR1 bit is set, and the handler is
called (through the vector table VTOR points to, IRQ `extiIrq`) only when the
pending bit is set and IMR1 and the NVIC enable it. Each call records the
handler's writes with the clock cycles spent before each, counted from the
executed opcodes with the ARMv6-M cycle table (only the opcodes such a
handler needs are known; any other is reported). A timer's EGR.UG puts CNT
to 0 and, in one-pulse mode (CR1.OPM), clears CEN as the update does.

Input: one JSON argument {elf, package, extClockHz, maxInstructions, isrIrq, isrCalls, pinPort, pinBit,
extiIrq, extiLine, edges}.
Output: one JSON object on stdout. `--version` alone prints "python3-unicorn <version>".
"""
import json
import struct
import sys
import types


def import_unicorn_fast():
    """Debian's python3-unicorn 2.0 imports distutils.sysconfig and pkg_resources
    without using them (it loads libunicorn.so.2 by name); those two imports
    pull in setuptools and took about 1 s of a 1.3 s run on a busy machine.
    Empty stand-ins are tried first; a unicorn that does use them gets the
    real modules on the second try."""
    stubs = [n for n in ("distutils", "distutils.sysconfig", "pkg_resources") if n not in sys.modules]
    for n in stubs:
        sys.modules[n] = types.ModuleType(n)
    try:
        import unicorn  # noqa: F401
    except Exception:  # the stand-ins were not enough: import everything for real
        for n in list(sys.modules):
            if n in stubs or n == "unicorn" or n.startswith("unicorn."):
                del sys.modules[n]


import_unicorn_fast()
from unicorn import (UC_ARCH_ARM, UC_HOOK_CODE, UC_MODE_MCLASS, UC_MODE_THUMB,  # noqa: E402
                     Uc, UcError, __version__ as UNICORN_VERSION)
from unicorn.arm_const import UC_ARM_REG_LR, UC_ARM_REG_PC, UC_ARM_REG_SP  # noqa: E402

FLASH = 0x08000000
FLASH_SIZE = 64 * 1024
RAM = 0x20000000
RAM_SIZE = 8 * 1024
RETURN_TRAP = 0x1FFF0000  # an otherwise unused page: handler calls return here

RCC = 0x40021000
FLASH_R = 0x40022000
NAMES = {
    RCC + 0x00: "RCC_CR", RCC + 0x08: "RCC_CFGR", RCC + 0x0C: "RCC_PLLCFGR",
    RCC + 0x34: "RCC_IOPENR", RCC + 0x38: "RCC_AHBENR", RCC + 0x3C: "RCC_APBENR1",
    RCC + 0x40: "RCC_APBENR2", FLASH_R + 0x00: "FLASH_ACR", 0xE000E100: "NVIC_ISER",
    0xE000E180: "NVIC_ICER",
}
TIMERS = {"TIM2": (0x40000000, 0, 0xFFFFFFFF), "TIM3": (0x40000400, 1, 0xFFFF)}  # base, APBENR1 bit, ARR reset
TIM_REGS = ["CR1", "CR2", "SMCR", "DIER", "SR", "EGR", "CCMR1", "CCMR2", "CCER", "CNT", "PSC", "ARR",
            "RCR", "CCR1", "CCR2", "CCR3", "CCR4"]
EXTI = 0x40021800
for off, r in [(0x00, "RTSR1"), (0x04, "FTSR1"), (0x0C, "RPR1"), (0x10, "FPR1"), (0x60, "EXTICR1"),
               (0x64, "EXTICR2"), (0x80, "IMR1")]:
    NAMES[EXTI + off] = f"EXTI_{r}"
NAMES[0xE000ED08] = "VTOR"
GPIO = {"A": (0x50000000, 0, 0xEBFFFFFF), "B": (0x50000400, 1, 0xFFFFFFFF), "C": (0x50000800, 2, 0xFFFFFFFF)}
GPIO_REGS = ["MODER", "OTYPER", "OSPEEDR", "PUPDR", "IDR", "ODR", "BSRR", "LCKR", "AFRL", "AFRH", "BRR"]
for t, (base, _, _) in TIMERS.items():
    for i, r in enumerate(TIM_REGS):
        NAMES[base + 4 * i] = f"{t}_{r}"
for p, (base, _, _) in GPIO.items():
    for i, r in enumerate(GPIO_REGS):
        NAMES[base + 4 * i] = f"GPIO{p}_{r}"

PACKAGES_WITH_OSC_OUT = {"LQFP-48", "LQFP-32", "UFQFPN-48", "UFQFPN-32"}  # not the TSSOP-20 or SO-8


def armv6m_cycles(op):
    """ARMv6-M Architecture Reference Manual / Cortex-M0+ TRM instruction timing, for the opcodes a
    trigger handler uses; -1000 marks an opcode this table does not know (the total then goes negative)."""
    if op & 0xF800 == 0x4800:  # ldr rt, [pc, #imm]
        return 2
    if op & 0xF800 == 0x2000:  # movs rd, #imm
        return 1
    if op & 0xF800 == 0x6000:  # str rt, [rn, #imm]
        return 2
    if op == 0x4770:  # bx lr
        return 3
    return -1000


def load_elf(uc, path):
    data = open(path, "rb").read()
    if data[:4] != b"\x7fELF" or data[4] != 1 or data[5] != 1:
        raise SystemExit(json.dumps({"error": "not a 32-bit little-endian ELF"}))
    phoff, = struct.unpack_from("<I", data, 0x1C)
    phentsize, phnum = struct.unpack_from("<HH", data, 0x2A)
    for i in range(phnum):
        p_type, p_offset, _vaddr, p_paddr, p_filesz, _memsz, _flags, _align = struct.unpack_from(
            "<8I", data, phoff + i * phentsize)
        if p_type == 1 and p_filesz > 0:  # PT_LOAD: the flash image at its load address
            if not (FLASH <= p_paddr and p_paddr + p_filesz <= FLASH + FLASH_SIZE):
                raise SystemExit(json.dumps({"error": f"loadable segment at {p_paddr:#x} is outside flash"}))
            uc.mem_write(p_paddr, data[p_offset:p_offset + p_filesz])


class Board:
    def __init__(self, package, ext_clock_hz):
        self.package = package
        self.ext_clock_hz = ext_clock_hz
        self.regs = {RCC + 0x00: 0x00000500, RCC + 0x0C: 0x00001000}
        for base, _, arr in TIMERS.values():
            self.regs[base + 0x2C] = arr
        for base, _, moder in GPIO.values():
            self.regs[base] = moder
        self.log = []
        self.faults = []
        self.reads = {}
        self.sws = 0  # SYSCLK source: 0 HSISYS, 1 HSE, 2 PLLRCLK
        self.handler_writes = None  # during an EXTI handler call: [name, value, cycles before the write]
        self.handler_ops = []

    def cycles_before(self):
        """ARMv6-M cycles of the handler's instructions before the one now executing."""
        total = 0
        for op in self.handler_ops[:-1]:
            total += armv6m_cycles(op)
        return total

    def get(self, addr):
        return self.regs.get(addr, 0)

    # --- clock tree (RM0444 RCC) ---
    def hse_runs(self):
        cr = self.get(RCC)
        if not cr & (1 << 16):
            return False
        if cr & (1 << 18):
            return self.ext_clock_hz is not None
        return self.package in PACKAGES_WITH_OSC_OUT

    def pll(self):
        """(runs, output Hz) of PLLRCLK from RCC_PLLCFGR."""
        cfg = self.get(RCC + 0x0C)
        src = cfg & 3
        m = ((cfg >> 4) & 7) + 1
        n = (cfg >> 8) & 0x7F
        r_field = (cfg >> 29) & 7
        if src == 2:
            fin = 16e6
        elif src == 3 and self.hse_runs():
            fin = float(self.ext_clock_hz or 0)
        else:
            return False, 0.0
        if r_field == 0 or not 8 <= n <= 86:
            return False, 0.0
        f_in = fin / m
        vco = f_in * n
        if not (2.66e6 <= f_in <= 16e6 and 64e6 <= vco <= 344e6):
            return False, 0.0
        return bool(self.get(RCC) & (1 << 24)), vco / (r_field + 1)

    def source_hz(self, sw):
        if sw == 0:
            return 16e6 / (1 << ((self.get(RCC) >> 11) & 7))
        if sw == 1:
            return float(self.ext_clock_hz) if self.hse_runs() else None
        if sw == 2:
            runs, hz = self.pll()
            cfg = self.get(RCC + 0x0C)
            return hz if runs and cfg & (1 << 28) and hz <= 64e6 else None
        return None

    def sysclk(self):
        return self.source_hz(self.sws)

    def check_latency(self, why):
        hz = self.sysclk() or 0
        need = 0 if hz <= 24e6 else 1 if hz <= 48e6 else 2
        have = self.get(FLASH_R) & 7
        if have < need:
            self.faults.append(f"FLASH_ACR LATENCY {have} is too few wait states for SYSCLK {hz:.0f} Hz ({why})")

    def read(self, addr):
        self.reads[addr] = self.reads.get(addr, 0) + 1
        self.check_clocked(addr, "read")
        v = self.get(addr)
        if addr == RCC:
            v &= ~((1 << 10) | (1 << 17) | (1 << 25))
            if v & (1 << 8):
                v |= 1 << 10
            if self.hse_runs():
                v |= 1 << 17
            if self.pll()[0]:
                v |= 1 << 25
        elif addr == RCC + 0x08:
            v = (v & ~(7 << 3)) | (self.sws << 3)
        return v & 0xFFFFFFFF

    def check_clocked(self, addr, what):
        for t, (base, bit, _) in TIMERS.items():
            if base <= addr < base + 0x400 and not self.get(RCC + 0x3C) & (1 << bit):
                self.faults.append(f"{what} of {NAMES.get(addr, hex(addr))} before RCC_APBENR1 {t}EN")
                return False
        for p, (base, bit, _) in GPIO.items():
            if base <= addr < base + 0x400 and not self.get(RCC + 0x34) & (1 << bit):
                self.faults.append(f"{what} of {NAMES.get(addr, hex(addr))} before RCC_IOPENR GPIO{p}EN")
                return False
        return True

    def write(self, addr, value):
        name = NAMES.get(addr, hex(addr))
        self.log.append([name, value])
        if self.handler_writes is not None:
            self.handler_writes.append([name, value, self.cycles_before()])
        if not self.check_clocked(addr, "write"):
            return  # an unclocked block drops the write
        if addr == RCC:
            old = self.get(RCC)
            if (value ^ old) & (1 << 18) and old & (1 << 16):
                self.faults.append("RCC_CR HSEBYP changed while HSEON was set (RM0444: only with HSE off)")
            self.regs[addr] = value
            if self.sws == 0:
                self.check_latency("HSIDIV change")
            return
        if addr == RCC + 0x08:
            self.regs[addr] = value
            sw = value & 7
            if sw != self.sws and self.source_hz(sw) is not None:
                self.sws = sw
                self.check_latency("SYSCLK switch")
            return
        if addr == 0xE000E100:
            self.regs[addr] = self.get(addr) | value
            return
        if addr in (EXTI + 0x0C, EXTI + 0x10):  # RPR1 / FPR1: write 1 to clear
            self.regs[addr] = self.get(addr) & ~value
            return
        for base, _, _ in TIMERS.values():
            if addr == base + 0x10:  # SR: rc_w0
                self.regs[addr] = self.get(addr) & value
                return
            if addr == base + 0x14:  # EGR: UG sets UIF, count to 0; in one-pulse mode the update clears CEN
                if value & 1:
                    self.regs[base + 0x10] = self.get(base + 0x10) | 1
                    self.regs[base + 0x24] = 0
                    if self.get(base) & (1 << 3):
                        self.regs[base] = self.get(base) & ~1
                return
        for base, _, _ in GPIO.values():
            if addr == base + 0x18:  # BSRR
                odr = self.get(base + 0x14)
                self.regs[base + 0x14] = (odr | (value & 0xFFFF)) & ~((value >> 16) & 0xFFFF)
                return
            if addr == base + 0x28:  # BRR
                self.regs[base + 0x14] = self.get(base + 0x14) & ~(value & 0xFFFF)
                return
        self.regs[addr] = value


def main():
    if sys.argv[1:] == ["--version"]:
        print(f"python3-unicorn {UNICORN_VERSION}")
        return
    args = json.loads(sys.argv[1])
    board = Board(args.get("package", "TSSOP-20"), args.get("extClockHz"))
    uc = Uc(UC_ARCH_ARM, UC_MODE_THUMB | UC_MODE_MCLASS)
    uc.mem_map(FLASH, FLASH_SIZE)
    uc.mem_map(RAM, RAM_SIZE)
    uc.mem_map(RETURN_TRAP, 0x1000)
    uc.mem_write(RETURN_TRAP, b"\xfe\xe7")  # b .
    for base, size in [(0x40000000, 0x30000), (0x50000000, 0x2000), (0xE0000000, 0x100000)]:
        uc.mmio_map(base, size,
                    lambda _uc, off, _size, b: board.read(b + off), base,
                    lambda _uc, off, _size, value, b: board.write(b + off, value), base)
    load_elf(uc, args["elf"])
    sp, reset = struct.unpack("<II", uc.mem_read(FLASH, 8))
    state = {"steps": 0, "idle": None}

    def on_code(u, address, size, _user):
        state["steps"] += 1
        if board.handler_writes is not None:
            board.handler_ops.append(struct.unpack("<H", u.mem_read(address, 2))[0] if size == 2 else 0)
        if size == 2:
            op = struct.unpack("<H", u.mem_read(address, 2))[0]
            if op in (0xBF30, 0xE7FE):  # wfi; b .
                state["idle"] = {"pc": address, "kind": "wfi" if op == 0xBF30 else "branch-to-self"}
                u.emu_stop()

    uc.hook_add(UC_HOOK_CODE, on_code)
    uc.reg_write(UC_ARM_REG_SP, sp)
    out = {"resetVector": reset, "initialSp": sp}
    try:
        uc.emu_start(reset | 1, 0, 0, int(args.get("maxInstructions", 200000)))
    except UcError as e:
        out["error"] = f"emulation stopped at {uc.reg_read(UC_ARM_REG_PC):#x}: {e}"
    out["steps"] = state["steps"]
    out["idle"] = state["idle"]
    if state["idle"] is None and "error" not in out:
        addr, count = max(board.reads.items(), key=lambda kv: kv[1]) if board.reads else (0, 0)
        cr = board.get(RCC)
        pending = []
        if cr & (1 << 16) and not board.hse_runs():
            pending.append("HSERDY cannot come: HSEON without " + (
                "an external clock on OSC_IN" if cr & (1 << 18) else
                f"HSEBYP, and the {board.package} package has no OSC_OUT for a crystal"))
        if cr & (1 << 24) and not board.pll()[0]:
            pending.append("PLLRDY cannot come: RCC_PLLCFGR is not a legal setting from a running source")
        out["stuck"] = {"pc": uc.reg_read(UC_ARM_REG_PC), "polled": NAMES.get(addr, hex(addr)),
                        "reads": count, "pending": pending}

    calls = []
    irq = args.get("isrIrq")
    if state["idle"] is not None and irq is not None:
        handler = struct.unpack("<I", uc.mem_read(FLASH + 4 * (16 + irq), 4))[0]
        out["handler"] = handler
        port = args.get("pinPort", "A")
        bit = int(args.get("pinBit", 0))
        gbase = GPIO[port][0]
        # The update event sets UIF on every timer that counts with its update interrupt on.
        tim_sr = [base + 0x10 for base, _, _ in TIMERS.values()
                  if board.get(base) & 1 and board.get(base + 0x0C) & 1]
        for _ in range(int(args.get("isrCalls", 0))):
            for a in tim_sr:
                board.regs[a] = board.get(a) | 1
            uc.reg_write(UC_ARM_REG_SP, sp - 64)
            uc.reg_write(UC_ARM_REG_LR, RETURN_TRAP | 1)
            state["idle"] = None
            try:
                uc.emu_start(handler | 1, RETURN_TRAP, 0, 20000)
            except UcError as e:
                out["error"] = f"handler stopped at {uc.reg_read(UC_ARM_REG_PC):#x}: {e}"
                break
            if uc.reg_read(UC_ARM_REG_PC) != RETURN_TRAP:
                out["error"] = f"handler did not return (pc {uc.reg_read(UC_ARM_REG_PC):#x})"
                break
            calls.append({"level": (board.get(gbase + 0x14) >> bit) & 1,
                          "uifCleared": bool(tim_sr) and all(not board.get(a) & 1 for a in tim_sr)})
    out["isrCalls"] = calls

    edge_calls = []
    line = args.get("extiLine")
    if state["idle"] is not None and line is not None:
        irq = int(args["extiIrq"])
        bit = 1 << int(line)
        for edge in args.get("edges", []):
            sel = board.get(EXTI + (0x00 if edge == "rising" else 0x04))
            pend = EXTI + (0x0C if edge == "rising" else 0x10)
            if sel & bit:
                board.regs[pend] = board.get(pend) | bit
            pending = (board.get(EXTI + 0x0C) | board.get(EXTI + 0x10)) & bit
            enabled = board.get(EXTI + 0x80) & bit and board.get(0xE000E100) & (1 << irq)
            entry = {"edge": edge, "called": False}
            if pending and enabled:
                vtor = board.get(0xE000ED08)
                handler = struct.unpack("<I", uc.mem_read(vtor + 4 * (16 + irq), 4))[0]
                entry["handler"] = handler
                board.handler_writes = []
                board.handler_ops = []
                uc.reg_write(UC_ARM_REG_SP, sp - 64)
                uc.reg_write(UC_ARM_REG_LR, RETURN_TRAP | 1)
                try:
                    uc.emu_start(handler | 1, RETURN_TRAP, 0, 200)
                    entry["called"] = uc.reg_read(UC_ARM_REG_PC) == RETURN_TRAP
                except UcError as e:
                    entry["error"] = f"handler stopped at {uc.reg_read(UC_ARM_REG_PC):#x}: {e}"
                entry["writes"] = board.handler_writes
                entry["cycles"] = sum(armv6m_cycles(op) for op in board.handler_ops)
                board.handler_writes = None
            entry["pendingAfter"] = bool((board.get(EXTI + 0x0C) | board.get(EXTI + 0x10)) & bit)
            entry["timers"] = {t: {"CR1": board.get(base), "CNT": board.get(base + 0x24)}
                               for t, (base, _, _) in TIMERS.items()}
            edge_calls.append(entry)
    out["edgeCalls"] = edge_calls
    out["exti"] = {r: board.get(EXTI + off) for off, r in [(0x00, "RTSR1"), (0x04, "FTSR1"), (0x60, "EXTICR1"),
                                                            (0x80, "IMR1")]}
    out["vtor"] = board.get(0xE000ED08)

    tims = {}
    for t, (base, _, _) in TIMERS.items():
        tims[t] = {r: board.get(base + 4 * i) for i, r in enumerate(TIM_REGS)}
    gpios = {}
    for p, (base, _, _) in GPIO.items():
        gpios[p] = {r: board.get(base + 4 * i) for i, r in enumerate(GPIO_REGS)}
    out.update({
        "sysclkHz": board.sysclk(),
        "sws": board.sws,
        "rcc": {"CR": board.read(RCC), "CFGR": board.read(RCC + 0x08), "PLLCFGR": board.get(RCC + 0x0C),
                "IOPENR": board.get(RCC + 0x34), "APBENR1": board.get(RCC + 0x3C)},
        "flashAcr": board.get(FLASH_R),
        "nvicIser": board.get(0xE000E100),
        "timers": tims,
        "gpio": gpios,
        "writes": board.log,
        "faults": board.faults,
    })
    print(json.dumps(out))


if __name__ == "__main__":
    main()
