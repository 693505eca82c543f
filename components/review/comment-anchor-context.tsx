"use client";
// The compare page's one anchored comment form and the "Comment" buttons on the
// rows of its board and register tables share the chosen anchor here: a row's
// button picks its quantity or register, and the form brings itself into view
// with the cursor in its text box.
import { createContext, useCallback, useContext, useMemo, useState } from "react";

type Chosen = {
  /** anchor key, "" for the whole revision */
  key: string;
  setKey: (key: string) => void;
  /** a row's button: pick the anchor and bring the form up */
  choose: (key: string) => void;
  /** grows on each row choice; the form focuses itself when it changes */
  asked: number;
};

const AnchorChoiceContext = createContext<Chosen | null>(null);

export function CommentAnchorProvider({ children }: { children: React.ReactNode }) {
  const [key, setKey] = useState("");
  const [asked, setAsked] = useState(0);
  const choose = useCallback((k: string) => {
    setKey(k);
    setAsked((n) => n + 1);
  }, []);
  const value = useMemo(() => ({ key, setKey, choose, asked }), [key, choose, asked]);
  return <AnchorChoiceContext.Provider value={value}>{children}</AnchorChoiceContext.Provider>;
}

export function useCommentAnchor(): Chosen | null {
  return useContext(AnchorChoiceContext);
}
